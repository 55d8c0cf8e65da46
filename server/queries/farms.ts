import { execute, selectRow, selectRows, type InTransaction } from './sql.ts';

export interface FarmRow {
  id: string;
  organisationId: string;
  name: string;
}

const FARM_COLUMNS = 'id, organisation_id AS "organisationId", name';

/** The organisation's farms by name, only those in `ids` when given. */
export const listFarmsOfOrganisation = (organisationId: string, ids: string[] | null, options: InTransaction = {}) =>
  ids && !ids.length
    ? Promise.resolve([])
    : selectRows<FarmRow>(
        `SELECT ${FARM_COLUMNS} FROM farms WHERE organisation_id = :organisationId${ids ? ' AND id IN (:ids)' : ''} ORDER BY name ASC`,
        { organisationId, ids },
        options,
      );

export const findFarmInOrganisation = (organisationId: string, id: string, options: InTransaction = {}) =>
  selectRow<FarmRow>(`SELECT ${FARM_COLUMNS} FROM farms WHERE id = :id AND organisation_id = :organisationId`, { id, organisationId }, options);

/** Id and name of each of these farms (the ids come from the caller's own rows). */
export const findFarmNames = (ids: string[], options: InTransaction = {}) =>
  ids.length ? selectRows<{ id: string; name: string }>('SELECT id, name FROM farms WHERE id IN (:ids)', { ids }, options) : Promise.resolve([]);

export const insertFarm = async (farm: { organisationId: string; name: string }, options: InTransaction = {}) =>
  (await selectRow<FarmRow>(`INSERT INTO farms (organisation_id, name) VALUES (:organisationId, :name) RETURNING ${FARM_COLUMNS}`, farm, options))!;

export const renameFarm = (id: string, name: string, options: InTransaction = {}) =>
  execute('UPDATE farms SET name = :name, updated_at = now() WHERE id = :id', { id, name }, options);

export const deleteFarm = (id: string, options: InTransaction = {}) => execute('DELETE FROM farms WHERE id = :id', { id }, options);

/** Ids of the organisation's farms holding a field a scout is assigned to. */
export const listFarmIdsOfScout = async (organisationId: string, userId: string) =>
  (
    await selectRows<{ id: string }>(
      `SELECT DISTINCT f.farm_id AS id FROM fields f JOIN field_assignments a ON a.field_id = f.id WHERE a.user_id = :userId AND f.organisation_id = :org`,
      { userId, org: organisationId },
    )
  ).map((r) => r.id);

/** Ids of the organisation's farms a grower is linked to. */
export const listFarmIdsOfGrower = async (organisationId: string, userId: string) =>
  (
    await selectRows<{ id: string }>(
      `SELECT g.farm_id AS id FROM farm_growers g JOIN farms f ON f.id = g.farm_id WHERE g.user_id = :userId AND f.organisation_id = :org`,
      { userId, org: organisationId },
    )
  ).map((r) => r.id);
