import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { TextField } from '../../../components/ui/text-field';
import { SelectField } from '../../../components/ui/select-field';
import { sentence } from '../../../lib/api-errors';
import { SPRAY_AMOUNT_UNITS, WIND_DIRECTIONS } from '../../../../shared/domain/spray-records';
import type { TaskQuantity } from '../../../../shared/domain/tasks';
import type { CompleteFormInput } from '../lib/complete-form';

const message = (m: unknown) => (typeof m === 'string' && m ? sentence(m) : undefined);

/**
 * The spray record of a herbicide step: what 7 CFR Part 110 asks of a restricted-use application
 * (product, EPA Reg. No., total amount, area, crop or site, applicator and certification number)
 * plus wind and air temperature. Part of "Mark done"; the date and the unit's location come with it.
 */
export function SprayRecordFields({ products, register, errors }: { products: readonly TaskQuantity[]; register: UseFormRegister<CompleteFormInput>; errors: FieldErrors<CompleteFormInput> }) {
  const e = errors.spray;
  return (
    <fieldset className="flex flex-col gap-3 rounded border border-clay/50 bg-clay/5 p-3">
      <legend className="px-1 text-sm font-semibold text-ink">Spray record</legend>
      <p className="text-sm text-ink">
        The label is the law: apply only as the label directs. Restricted-use products need a certified applicator; the firm keeps this record at least two years.
      </p>
      {products.map((p, i) => (
        <div key={p.key} className="grid grid-cols-[1fr_auto] gap-2">
          <TextField label={`${p.label}: total applied`} type="number" inputMode="decimal" step="any" min={0} {...register(`spray.products.${i}.amount`, { valueAsNumber: true })} error={message(e?.products?.[i]?.amount?.message)} />
          <SelectField label="Unit" {...register(`spray.products.${i}.unit`)} error={message(e?.products?.[i]?.unit?.message)}>
            {SPRAY_AMOUNT_UNITS.map((u) => (
              <option key={u} value={u}>
                {u}
              </option>
            ))}
          </SelectField>
          <TextField label="EPA Reg. No. (from the label)" hint="Optional when the library has it, e.g. 524-475" {...register(`spray.products.${i}.epaRegNo`, { setValueAs: (v: string) => (v ? v : undefined) })} error={message(e?.products?.[i]?.epaRegNo?.message)} />
        </div>
      ))}
      <TextField label="Crop or site treated" {...register('spray.cropOrSite')} error={message(e?.cropOrSite?.message)} />
      <TextField label="Area treated (acres)" type="number" inputMode="decimal" step="any" min={0} {...register('spray.areaTreatedAcres', { valueAsNumber: true })} error={message(e?.areaTreatedAcres?.message)} />
      <div className="grid grid-cols-3 gap-2">
        <TextField label="Wind (mph)" type="number" inputMode="decimal" step="any" min={0} {...register('spray.windMph', { valueAsNumber: true })} error={message(e?.windMph?.message)} />
        <SelectField label="Wind from" {...register('spray.windDirection')} error={message(e?.windDirection?.message)}>
          {WIND_DIRECTIONS.map((d) => (
            <option key={d} value={d}>
              {d}
            </option>
          ))}
        </SelectField>
        <TextField label="Air temp (°F)" type="number" inputMode="decimal" step="any" {...register('spray.airTempF', { valueAsNumber: true })} error={message(e?.airTempF?.message)} />
      </div>
      <TextField label="Applicator’s name" autoComplete="name" {...register('spray.applicatorName')} error={message(e?.applicatorName?.message)} />
      <TextField label="Certification number" hint="Required for restricted-use products." {...register('spray.applicatorCertNo')} error={message(e?.applicatorCertNo?.message)} />
    </fieldset>
  );
}
