// The grower's read-only home: their farms, each with its fields.
import { PageFrame } from '../../../components/page-frame.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import type { FieldView as Field } from '@shared/schemas/fields.ts';
import { useFields } from '../../../lib/api/get-fields.ts';
import { FieldCard } from './fields-home.tsx';

function byFarm(fields: Field[]) {
  const farms = new Map<string, { name: string; fields: Field[] }>();
  for (const field of fields) {
    const farm = farms.get(field.farmId) ?? { name: field.farmName, fields: [] };
    farm.fields.push(field);
    farms.set(field.farmId, farm);
  }
  return [...farms.entries()].sort(([, a], [, b]) => a.name.localeCompare(b.name));
}

export function MyFarmsPage() {
  const fields = useFields();
  return (
    <PageFrame title="My farms" eyebrow="Your farms and fields, as your adviser sees them">
      {fields.isPending ? (
        <LoadingState label="Loading your farms…" />
      ) : fields.isError ? (
        <ErrorState error={fields.error} onRetry={() => fields.refetch()} />
      ) : fields.data.length === 0 ? (
        <EmptyState title="No farms linked to your account yet">Your adviser links your account to your farms; ask them if this stays empty.</EmptyState>
      ) : (
        byFarm(fields.data).map(([farmId, farm]) => (
          <section key={farmId} aria-labelledby={`farm-${farmId}`}>
            <h2 id={`farm-${farmId}`} className="mb-2 text-lg font-semibold text-soil-800">
              {farm.name}
            </h2>
            <ul className="grid gap-3 sm:grid-cols-2">
              {farm.fields.map((field) => (
                <FieldCard key={field.id} field={field} />
              ))}
            </ul>
          </section>
        ))
      )}
    </PageFrame>
  );
}
