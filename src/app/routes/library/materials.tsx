import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { SelectField } from '../../../components/ui/select-field';
import { useMaterials } from '../../../features/library/api/get-materials';
import { MATERIAL_KIND_LABELS, MaterialForm } from '../../../features/library/components/material-form';
import { MaterialTable } from '../../../features/library/components/material-table';
import { MATERIAL_KINDS, type MaterialKind } from '../../../../shared/schemas/library';

/** The firm's materials: a table per kind, "Add material", and edit forms per kind. */
export function MaterialsPage() {
  const materials = useMaterials();
  const [adding, setAdding] = useState<MaterialKind | null>(null);
  if (materials.isPending) return <Loading />;
  if (materials.isError) return <ErrorPanel error={materials.error} />;
  return (
    <div className="flex flex-col gap-4">
      {adding ? (
        <Card title="Add material">
          <div className="mb-3 max-w-xs">
            <SelectField label="Kind" value={adding} onChange={(e) => setAdding(e.target.value as MaterialKind)}>
              {MATERIAL_KINDS.map((k) => (
                <option key={k} value={k}>
                  {MATERIAL_KIND_LABELS[k]}
                </option>
              ))}
            </SelectField>
          </div>
          <MaterialForm key={adding} kind={adding} onDone={() => setAdding(null)} />
        </Card>
      ) : (
        <div>
          <Button type="button" onClick={() => setAdding('seed')}>
            Add material
          </Button>
        </div>
      )}
      {MATERIAL_KINDS.map((kind) => {
        const rows = materials.data.filter((m) => m.kind === kind);
        return (
          <Card key={kind} title={<span id={`materials-${kind}`}>{MATERIAL_KIND_LABELS[kind]}</span>}>
            <section aria-labelledby={`materials-${kind}`}>
              {rows.length === 0 ? (
                <EmptyState title={`No ${MATERIAL_KIND_LABELS[kind].toLowerCase()} yet`}>Add one with “Add material”.</EmptyState>
              ) : (
                <MaterialTable kind={kind} materials={rows} />
              )}
            </section>
          </Card>
        );
      })}
    </div>
  );
}
