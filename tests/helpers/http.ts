// A supertest agent that keeps its cookies and sends the CSRF token like the real client does.
import request from 'supertest';
import type { Express } from 'express';
import { createApp } from '../../server/app.ts';
import { TEST_PASSWORD } from './org.ts';

let app: Express | null = null;
export const testApp = () => (app ??= createApp());

export interface Client {
  agent: ReturnType<typeof request.agent>;
  csrf: string;
  get(url: string): request.Test;
  post(url: string, body?: object): request.Test;
  put(url: string, body?: object): request.Test;
  patch(url: string, body?: object): request.Test;
  delete(url: string): request.Test;
}

export async function anonymous(): Promise<Client> {
  const agent = request.agent(testApp());
  const res = await agent.get('/api/auth/csrf').expect(200);
  const client: Client = {
    agent,
    csrf: res.body.csrfToken,
    get: (url) => agent.get(url),
    post: (url, body) =>
      agent
        .post(url)
        .set('x-csrf-token', client.csrf)
        .send(body ?? {}),
    put: (url, body) =>
      agent
        .put(url)
        .set('x-csrf-token', client.csrf)
        .send(body ?? {}),
    patch: (url, body) =>
      agent
        .patch(url)
        .set('x-csrf-token', client.csrf)
        .send(body ?? {}),
    delete: (url) => agent.delete(url).set('x-csrf-token', client.csrf),
  };
  return client;
}

export async function signedIn(email: string, password = TEST_PASSWORD): Promise<Client> {
  const client = await anonymous();
  const res = await client.post('/api/auth/sign-in', { email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  client.csrf = res.body.csrfToken;
  return client;
}
