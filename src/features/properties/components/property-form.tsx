import type { ReactNode } from 'react';
import { useForm, type FieldError, type UseFormRegisterReturn } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { PropertyCreateSchema, PropertyUpdateSchema, REGIONS, type PropertyDto, type Region } from '../../../../shared/schemas/property';
import type { ClientDto } from '../../../../shared/schemas/client';
import { LIMITS } from '../../../../shared/limits';
import { useCreateProperty } from '../api/create-property';
import { useUpdateProperty } from '../api/update-property';
import { TextField } from '../../../components/ui/text-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { SelectField } from '../../../components/ui/select-field';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';

/** How each planting region reads in the interface. */
export const REGION_LABELS: Record<Region, string> = {
  south: 'South',
  midsouth: 'Mid-South',
  midwest: 'Midwest',
  north: 'North',
};

/** The region's label, or a dash. */
export const regionLabel = (region: string | null): string => (region && region in REGION_LABELS ? REGION_LABELS[region as Region] : '—');

// The boundary is drawn or imported on the plan map, never typed into these forms.
const NewPropertySchema = PropertyCreateSchema.omit({ boundary: true });
const EditPropertySchema = PropertyUpdateSchema.omit({ boundary: true });

type FieldName = 'name' | 'county' | 'state' | 'region' | 'objectives' | 'notes';
const emptyToNull = (v: unknown) => (v === '' ? null : v);

/** The fields both property forms share. */
function PropertyFields({ field, errors, besideRegion }: { field: (name: FieldName) => UseFormRegisterReturn; errors: Partial<Record<FieldName, FieldError>>; besideRegion?: ReactNode }) {
  return (
    <>
      <TextField label="Property name" autoComplete="off" maxLength={LIMITS.nameMax} className="sm:col-span-2" error={errors.name?.message} {...field('name')} />
      <TextField label="County" autoComplete="off" error={errors.county?.message} {...field('county')} />
      <TextField label="State" autoComplete="off" error={errors.state?.message} {...field('state')} />
      <SelectField label="Region" hint="Sets the planting windows of the plan." error={errors.region?.message} {...field('region')}>
        <option value="">Not set</option>
        {REGIONS.map((r) => (
          <option key={r} value={r}>
            {REGION_LABELS[r]}
          </option>
        ))}
      </SelectField>
      {besideRegion}
      <TextAreaField label="Objectives" className="sm:col-span-2" hint="What the landowner wants from the land, in a sentence or two." error={errors.objectives?.message} {...field('objectives')} />
    </>
  );
}

/** The form for a new property of a client; the boundary follows on the plan map. */
export function NewPropertyForm({ clientId, onCreated, onCancel }: { clientId: number; onCreated: (property: PropertyDto) => void; onCancel: () => void }) {
  const create = useCreateProperty();
  const toast = useToast();
  const form = useForm<z.input<typeof NewPropertySchema>, unknown, z.output<typeof NewPropertySchema>>({
    resolver: zodResolver(NewPropertySchema),
    defaultValues: { clientId, name: '', county: '', state: '', objectives: '' },
  });
  const submit = form.handleSubmit((values) =>
    create.mutate(values, {
      onSuccess: (property) => {
        toast('success', `${property.name} added. Draw or import its boundary on the plan map.`);
        onCreated(property);
      },
      onError: (e) => toast('error', `The property was not added: ${e.message}`),
    }),
  );
  const field = (name: FieldName) => form.register(name, name === 'region' ? { setValueAs: emptyToNull } : undefined);
  return (
    <form onSubmit={submit} noValidate aria-label="New property" className="grid gap-3 sm:grid-cols-2">
      <PropertyFields field={field} errors={form.formState.errors} />
      <p className="rounded border-l-4 border-sky bg-sky/5 px-3 py-2 text-sm text-ink sm:col-span-2">
        The boundary comes next: saving opens the property’s plan map, where you draw it or import it from a GeoJSON, KML, GPX or zipped
        shapefile. Acres are measured from it.
      </p>
      <div className="flex flex-wrap gap-2 sm:col-span-2">
        <Button type="submit" busy={create.isPending}>
          Add property
        </Button>
        <Button type="button" variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** The edit form's starting values: empty text for missing figures, no region when none is set. */
function editDefaults(property: PropertyDto): z.input<typeof EditPropertySchema> {
  return {
    clientId: property.clientId,
    name: property.name,
    county: property.county ?? '',
    state: property.state ?? '',
    region: (property.region as Region | null) ?? undefined,
    objectives: property.objectives ?? '',
    notes: property.notes ?? '',
  };
}

/** The form that changes a property's details (not its boundary); `clients` lets it move to another client. */
export function EditPropertyForm({ property, clients }: { property: PropertyDto; clients: readonly ClientDto[] }) {
  const update = useUpdateProperty();
  const toast = useToast();
  const defaults = editDefaults(property);
  const form = useForm<z.input<typeof EditPropertySchema>, unknown, z.output<typeof EditPropertySchema>>({
    resolver: zodResolver(EditPropertySchema),
    defaultValues: defaults,
  });
  const submit = form.handleSubmit((input) =>
    update.mutate(
      { id: property.id, input },
      {
        onSuccess: (saved) => {
          toast('success', `${saved.name} saved.`);
          form.reset(editDefaults(saved));
        },
        onError: (e) => toast('error', `The changes were not saved: ${e.message}`),
      },
    ),
  );
  const field = (name: FieldName) => form.register(name, name === 'region' ? { setValueAs: emptyToNull } : undefined);
  const errors = form.formState.errors;
  return (
    <form onSubmit={submit} noValidate aria-label="Edit property" className="grid gap-3 sm:grid-cols-2">
      <PropertyFields
        field={field}
        errors={errors}
        besideRegion={
          <SelectField label="Client" hint="Move the property to another client." error={errors.clientId?.message} {...form.register('clientId', { setValueAs: (v) => Number(v) })}>
            {clients.some((c) => c.id === property.clientId) ? null : <option value={property.clientId}>{property.clientName}</option>}
            {clients.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name}
              </option>
            ))}
          </SelectField>
        }
      />
      <TextAreaField label="Notes" className="sm:col-span-2" hint="Gates, access, who to call before going in." error={errors.notes?.message} {...form.register('notes')} />
      <div className="flex flex-wrap items-center gap-3 sm:col-span-2">
        <Button type="submit" busy={update.isPending} disabled={!form.formState.isDirty}>
          Save changes
        </Button>
        {form.formState.isDirty ? (
          <Button type="button" variant="ghost" onClick={() => form.reset(defaults)}>
            Undo changes
          </Button>
        ) : (
          <span className="text-sm text-slate">No unsaved changes.</span>
        )}
      </div>
    </form>
  );
}
