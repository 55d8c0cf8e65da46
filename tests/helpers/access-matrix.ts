// The pieces of the access matrix, kept here so a new route file adds its rows in one line each:
// a world of two organisations with every role signed in, and a runner that asks each caller in turn.
import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { anonymous, signedIn, type Client } from './http.ts';
import { makeOrganisation, type TestOrganisation } from './org.ts';
import { createFarm, createField, createPest, uniqueName } from './farm-records.ts';
import { plainField } from './boundary-shapes.ts';
import { waitForMessage } from './mailbox.ts';

export const callers = ['anonymous', 'admin', 'adviser', 'scout', 'grower', 'otherAdmin'] as const;
export type Caller = (typeof callers)[number];
export type Expected = Record<Caller, number>;
export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/**
 * Ids the rows refer to as `{name}` in their paths and bodies. Home organisation:
 * - linkedFarm: linked to the grower; holds assignedField (assigned to the scout) and growerOnlyField;
 * - unlinkedFarm: no grower; holds scoutOnlyField (assigned to the scout);
 * - hiddenFarm: no grower, no assigned field; holds hiddenField.
 * `foreign*` ids belong to the other organisation.
 */
export interface AccessIds {
  linkedFarm: string;
  unlinkedFarm: string;
  hiddenFarm: string;
  assignedField: string;
  growerOnlyField: string;
  scoutOnlyField: string;
  hiddenField: string;
  pest: string;
  invitedUser: string;
  invitationMessage: string;
  scout: string;
  grower: string;
  adviser: string;
  foreignFarm: string;
  foreignField: string;
  foreignPest: string;
  foreignScout: string;
  foreignGrower: string;
}

export interface AccessWorld {
  home: TestOrganisation;
  other: TestOrganisation;
  ids: AccessIds;
  clients: Record<Caller, Client>;
  homeAdmin: Client;
  /** Makers for `{new…}` placeholders: a fresh record per request, so a delete that succeeds spoils nothing. */
  makers: Record<string, () => Promise<string>>;
}

async function messageIdTo(address: string) {
  await waitForMessage(address);
  const [row] = await sequelize.query<{ id: number }>('SELECT id FROM mailbox_messages WHERE :address = ANY(envelope_to) ORDER BY id LIMIT 1', {
    replacements: { address },
    type: QueryTypes.SELECT,
  });
  return String(row.id);
}

/** Builds both organisations through the API and signs every caller in once (the sign-in limiter counts per e-mail). */
export async function buildAccessWorld(): Promise<AccessWorld> {
  const home = await makeOrganisation('Home');
  const other = await makeOrganisation('Other');
  const clients: Record<Caller, Client> = {
    anonymous: await anonymous(),
    admin: await signedIn(home.users.admin.email),
    adviser: await signedIn(home.users.adviser.email),
    scout: await signedIn(home.users.scout.email),
    grower: await signedIn(home.users.grower.email),
    otherAdmin: await signedIn(other.users.admin.email),
  };
  const admin = clients.admin;
  const linkedFarm = await createFarm(admin, { contacts: [{ name: 'Grower Contact', email: `contact-${home.id.slice(0, 8)}@test.example` }] });
  const unlinkedFarm = await createFarm(admin);
  const hiddenFarm = await createFarm(admin);
  const assignedField = await createField(admin, linkedFarm.id, plainField(0));
  const growerOnlyField = await createField(admin, linkedFarm.id, plainField(1));
  const scoutOnlyField = await createField(admin, unlinkedFarm.id, plainField(2));
  const hiddenField = await createField(admin, hiddenFarm.id, plainField(3));
  await admin.post(`/api/farms/${linkedFarm.id}/growers`, { userId: home.users.grower.id }).expect(204);
  for (const field of [assignedField, scoutOnlyField]) {
    await admin.post(`/api/fields/${field.id}/scouts`, { userId: home.users.scout.id }).expect(204);
  }
  const pest = await createPest(admin);
  const invitedEmail = `invited-${crypto.randomBytes(4).toString('hex')}@test.example`;
  await admin.post('/api/users', { name: 'Invited Adviser', email: invitedEmail, role: 'adviser' }).expect(202);
  const [invited] = await sequelize.query<{ id: string }>('SELECT id FROM users WHERE email = :email', {
    replacements: { email: invitedEmail },
    type: QueryTypes.SELECT,
  });

  const foreignFarm = await createFarm(clients.otherAdmin);
  const foreignField = await createField(clients.otherAdmin, foreignFarm.id, plainField(4));
  const foreignPest = await createPest(clients.otherAdmin);

  const makers: AccessWorld['makers'] = {
    newFarm: async () => (await createFarm(admin)).id,
    newField: async () => (await createField(admin, hiddenFarm.id, plainField(5))).id,
    newEmail: async () => `new-${crypto.randomBytes(5).toString('hex')}@test.example`,
    newName: async () => uniqueName('Row'),
  };

  return {
    home,
    other,
    clients,
    homeAdmin: admin,
    makers,
    ids: {
      linkedFarm: linkedFarm.id,
      unlinkedFarm: unlinkedFarm.id,
      hiddenFarm: hiddenFarm.id,
      assignedField: assignedField.id,
      growerOnlyField: growerOnlyField.id,
      scoutOnlyField: scoutOnlyField.id,
      hiddenField: hiddenField.id,
      pest: pest.id,
      invitedUser: invited.id,
      invitationMessage: await messageIdTo(invitedEmail),
      scout: home.users.scout.id,
      grower: home.users.grower.id,
      adviser: home.users.adviser.id,
      foreignFarm: foreignFarm.id,
      foreignField: foreignField.id,
      foreignPest: foreignPest.id,
      foreignScout: other.users.scout.id,
      foreignGrower: other.users.grower.id,
    },
  };
}

/** Replaces `{name}` with an id of the world, or a fresh record for `{new…}`. */
export async function fillIn(template: string, world: AccessWorld): Promise<string> {
  let out = template;
  for (const match of template.matchAll(/\{(\w+)\}/g)) {
    const name = match[1];
    const value = name in world.makers ? await world.makers[name]() : (world.ids as unknown as Record<string, string | undefined>)[name];
    if (value === undefined) throw new Error(`the access matrix has no id named {${name}}`);
    out = out.replace(match[0], value);
  }
  return out;
}

async function fillInBody(body: AccessRow['body'], world: AccessWorld): Promise<object | undefined> {
  if (body === undefined) return undefined;
  const template = typeof body === 'function' ? body(world) : body;
  return JSON.parse(await fillIn(JSON.stringify(template), world));
}

export interface AccessRow {
  method: Method;
  path: string;
  expected: Expected;
  /** A JSON body, or one built from the world (for bodies that carry whole records, such as proposed zones). */
  body?: object | ((world: AccessWorld) => object);
  note?: string;
  /** Sends the request itself, for bodies that are not JSON (a multipart photo upload). */
  send?: (client: Client, url: string, world: AccessWorld) => Promise<{ status: number }>;
}

/** One line of the table: `row('DELETE', '/api/fields/{newField}', adminOnly(204))`. */
export const row = (method: Method, path: string, expected: Expected, body?: AccessRow['body'], note?: string): AccessRow => ({
  method,
  path,
  expected,
  body,
  note,
});

/** A route only an admin may use; `foreign` is what another organisation's admin gets (404 when the path names a home id). */
export const adminOnly = (ok: number, foreign = 404): Expected => ({ anonymous: 401, admin: ok, adviser: 403, scout: 403, grower: 403, otherAdmin: foreign });
/** A route every signed-in person may use; override the callers who see less. */
export const anySignedIn = (ok: number, overrides: Partial<Expected> = {}): Expected => ({
  anonymous: 401,
  admin: ok,
  adviser: ok,
  scout: ok,
  grower: ok,
  otherAdmin: ok,
  ...overrides,
});
export const everyone = (ok: number): Expected => ({ anonymous: ok, admin: ok, adviser: ok, scout: ok, grower: ok, otherAdmin: ok });

/** Sends the row's request as every caller and returns the statuses; admins go last, so a delete that works runs once other callers have been refused. */
export async function statusesFor(entry: AccessRow, world: AccessWorld): Promise<Expected> {
  const order: Caller[] = ['anonymous', 'otherAdmin', 'grower', 'scout', 'adviser', 'admin'];
  const actual = {} as Expected;
  for (const caller of order) {
    const client = world.clients[caller];
    const url = await fillIn(entry.path, world);
    const body = await fillInBody(entry.body, world);
    const method = entry.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
    const res = entry.send
      ? await entry.send(client, url, world)
      : method === 'get' || method === 'delete'
        ? await client[method](url)
        : await client[method](url, body);
    actual[caller] = res.status;
  }
  return Object.fromEntries(callers.map((c) => [c, actual[c]])) as Expected;
}

/** Every METHOD + path the app routes under /api, read from Express 5's router stack (mount paths from layer.rawPath). */
export function listApiRoutes(app: { router: { stack: unknown[] } }): Array<{ method: Method; path: string }> {
  type Layer = { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] }; rawPath?: unknown };
  const found: Array<{ method: Method; path: string }> = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods).filter((m) => m !== '_all')) {
          found.push({ method: method.toUpperCase() as Method, path: `${prefix}${layer.route.path}` });
        }
      } else if (layer.handle?.stack) {
        if (typeof layer.rawPath !== 'string') throw new Error('a router is mounted on a pattern the route list cannot read; mount it on a plain path');
        walk(layer.handle.stack, `${prefix}${layer.rawPath === '/' ? '' : layer.rawPath}`);
      }
    }
  };
  walk(app.router.stack as Layer[], '');
  return found.filter((r) => r.path.startsWith('/api/'));
}

/** Whether a row's path (with `{id}` placeholders and perhaps a query) is an instance of a route template (`:id`). */
export function rowMatchesRoute(rowPath: string, template: string) {
  const concrete = rowPath.split('?')[0].replace(/\{\w+\}/g, 'X');
  const pattern = template
    .split(/(:\w+)/)
    .map((part) => (part.startsWith(':') ? '[^/]+' : part.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')))
    .join('');
  return new RegExp(`^${pattern}$`).test(concrete);
}
