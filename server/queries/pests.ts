import type { PestKind, ThresholdBasis } from '../../shared/schemas/pests.ts';
import { selectRow, selectRows, type InTransaction } from './sql.ts';

export interface PestRow {
  id: string;
  organisationId: string;
  name: string;
  kind: PestKind;
  countUnit: string;
  actionThreshold: number;
  thresholdBasis: ThresholdBasis;
  thresholdNote: string;
  thresholdSource: string;
  active: boolean;
  rescoutDays: number;
  rescoutSource: string;
  rescoutConfirmed: boolean;
  crops: string[];
  thresholdConfirmed: boolean;
}

const PEST_COLUMNS = `id, organisation_id AS "organisationId", name, kind, count_unit AS "countUnit", action_threshold AS "actionThreshold",
  threshold_basis AS "thresholdBasis", threshold_note AS "thresholdNote", threshold_source AS "thresholdSource", active,
  rescout_days AS "rescoutDays", rescout_source AS "rescoutSource", rescout_confirmed AS "rescoutConfirmed", crops,
  threshold_confirmed AS "thresholdConfirmed"`;

// Replacements splice an array in as a list of values, so a crop list travels as JSON and becomes text[] in SQL.
const CROPS_FROM_JSON = 'ARRAY(SELECT c FROM jsonb_array_elements_text(CAST(:crops AS jsonb)) WITH ORDINALITY AS t(c, n) ORDER BY n)';
const cropsJson = (crops: string[] | undefined) => (crops === undefined ? null : JSON.stringify(crops));

export const listPestsOfOrganisation = (organisationId: string, includeInactive: boolean, options: InTransaction = {}) =>
  selectRows<PestRow>(
    `SELECT ${PEST_COLUMNS} FROM pests WHERE organisation_id = :organisationId${includeInactive ? '' : ' AND active = true'} ORDER BY name ASC`,
    { organisationId },
    options,
  );

export const findPestInOrganisation = (organisationId: string, id: string, options: InTransaction = {}) =>
  selectRow<PestRow>(`SELECT ${PEST_COLUMNS} FROM pests WHERE id = :id AND organisation_id = :organisationId`, { id, organisationId }, options);

/** Id and name of each of these pests (the ids come from the caller's own rows). */
export const findPestNames = (ids: string[], options: InTransaction = {}) =>
  ids.length ? selectRows<{ id: string; name: string }>('SELECT id, name FROM pests WHERE id IN (:ids)', { ids }, options) : Promise.resolve([]);

export interface NewPest {
  organisationId: string;
  name: string;
  kind: PestKind;
  countUnit: string;
  actionThreshold: number;
  thresholdBasis?: ThresholdBasis;
  thresholdNote?: string;
  thresholdSource: string;
  active?: boolean;
  rescoutDays?: number;
  rescoutSource?: string;
  rescoutConfirmed?: boolean;
  crops?: string[];
  thresholdConfirmed?: boolean;
}

export const insertPest = async (pest: NewPest, options: InTransaction = {}) =>
  (await selectRow<PestRow>(
    `INSERT INTO pests (organisation_id, name, kind, count_unit, action_threshold, threshold_basis, threshold_note, threshold_source, active,
                        rescout_days, rescout_source, rescout_confirmed, crops, threshold_confirmed)
     VALUES (:organisationId, :name, :kind, :countUnit, :actionThreshold, COALESCE(:thresholdBasis, 'mean'), COALESCE(:thresholdNote, ''), :thresholdSource,
             COALESCE(:active, true), COALESCE(:rescoutDays, 7), COALESCE(:rescoutSource, 'Weekly scouting, common practice; confirm for your region'),
             COALESCE(:rescoutConfirmed, false), COALESCE(${CROPS_FROM_JSON}, '{}'), COALESCE(:thresholdConfirmed, false))
     RETURNING ${PEST_COLUMNS}`,
    {
      thresholdBasis: null,
      thresholdNote: null,
      active: null,
      rescoutDays: null,
      rescoutSource: null,
      rescoutConfirmed: null,
      thresholdConfirmed: null,
      ...pest,
      crops: cropsJson(pest.crops),
    },
    options,
  ))!;

export type PestChanges = Partial<Omit<NewPest, 'organisationId'>>;

const pestColumn: Record<keyof PestChanges, string> = {
  name: 'name',
  kind: 'kind',
  countUnit: 'count_unit',
  actionThreshold: 'action_threshold',
  thresholdBasis: 'threshold_basis',
  thresholdNote: 'threshold_note',
  thresholdSource: 'threshold_source',
  active: 'active',
  rescoutDays: 'rescout_days',
  rescoutSource: 'rescout_source',
  rescoutConfirmed: 'rescout_confirmed',
  crops: 'crops',
  thresholdConfirmed: 'threshold_confirmed',
};
const pestValue: Partial<Record<keyof PestChanges, string>> = { crops: CROPS_FROM_JSON };

/** Writes the given details (the others stay as they are) and returns the row as stored. */
export const updatePest = async (id: string, changes: PestChanges, options: InTransaction = {}) => {
  const keys = (Object.keys(pestColumn) as (keyof PestChanges)[]).filter((k) => changes[k] !== undefined);
  const sets = keys.map((k) => `${pestColumn[k]} = ${pestValue[k] ?? `:${k}`}`).join(', ');
  return (await selectRow<PestRow>(
    `UPDATE pests SET ${sets ? `${sets}, ` : ''}updated_at = now() WHERE id = :id RETURNING ${PEST_COLUMNS}`,
    { ...changes, crops: cropsJson(changes.crops), id },
    options,
  ))!;
};
