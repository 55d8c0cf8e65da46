import { execute, selectRows, type InTransaction } from './sql.ts';

export const listGrowerIdsOfFarm = async (farmId: string, options: InTransaction = {}) =>
  (await selectRows<{ userId: string }>('SELECT user_id AS "userId" FROM farm_growers WHERE farm_id = :farmId', { farmId }, options)).map((r) => r.userId);

/** Links a grower to a farm; linking twice changes nothing. */
export const insertFarmGrower = (farmId: string, userId: string, options: InTransaction = {}) =>
  execute('INSERT INTO farm_growers (farm_id, user_id) VALUES (:farmId, :userId) ON CONFLICT DO NOTHING', { farmId, userId }, options);

export const deleteFarmGrower = (farmId: string, userId: string, options: InTransaction = {}) =>
  execute('DELETE FROM farm_growers WHERE farm_id = :farmId AND user_id = :userId', { farmId, userId }, options);
