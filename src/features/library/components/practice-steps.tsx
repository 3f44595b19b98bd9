import { TextField } from '../../../components/ui/text-field';
import type { MaterialDefinition, PracticeDefinition } from '../../../../shared/domain/practice';
import type { ServiceRate } from '../../../../shared/domain/service-rates';
import { applicationLines, serviceText, stepTimingText } from '../lib/practice-text';
import { editableNumbers } from '../lib/practice-edits';

const KIND_WORDS: Record<string, string> = {
  'soil-test': 'soil test',
  'hinge-cut': 'hinge-cut',
  'post-signs': 'post signs',
  'water-work': 'water work',
  'tree-stand': 'tree stand',
};

/**
 * A practice's steps in order: name and kind, timing in words with its source, what the step
 * applies and the services it uses. In edit mode the step's numbers become boxes.
 */
export function PracticeSteps({
  practice,
  materials,
  rates,
  editing,
  texts,
  errors,
  onText,
}: {
  practice: PracticeDefinition;
  materials: readonly MaterialDefinition[];
  rates: readonly ServiceRate[];
  editing: boolean;
  texts: Record<string, string>;
  errors: Record<string, string>;
  onText: (id: string, text: string) => void;
}) {
  const nameOf = (key: string) => practice.steps.find((s) => s.key === key)?.name ?? key;
  return (
    <ol className="flex flex-col gap-3">
      {practice.steps.map((step, index) => {
        const isAnchor = step.key === practice.anchorStepKey;
        const fields = editing ? editableNumbers(step, index, materials) : [];
        const applies = applicationLines(step.application, materials);
        return (
          <li key={step.key} className={`rounded-md border bg-card px-4 py-3 ${isAnchor ? 'border-moss/50' : 'border-rule'}`}>
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h3 className="font-sans text-base font-semibold">
                <span className="mr-2 text-slate tabular-nums">{index + 1}.</span>
                {step.name}
              </h3>
              <span className="rounded bg-paper px-2 py-0.5 text-xs uppercase tracking-wide text-slate">{KIND_WORDS[step.kind] ?? step.kind}</span>
            </div>
            <p className="mt-1 text-sm">
              <span className={isAnchor ? 'font-semibold text-moss-deep' : 'text-ink'}>{stepTimingText(step, practice)}</span>
              {step.timing?.source ? <span className="block text-xs text-slate">Source: {step.timing.source}</span> : null}
              {step.dependsOn?.length ? <span className="block text-xs text-slate">After: {step.dependsOn.map(nameOf).join(', ')}</span> : null}
            </p>
            {applies.length > 0 && !editing ? (
              <div className="mt-2">
                <p className="text-xs font-semibold uppercase tracking-wide text-slate">Applies</p>
                <ul className="list-disc pl-5 text-sm">
                  {applies.map((line, i) => (
                    <li key={i}>{line}</li>
                  ))}
                </ul>
              </div>
            ) : null}
            {fields.length > 0 ? (
              <div className="mt-3 grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
                {fields.map((f) => (
                  <TextField
                    key={f.id}
                    label={f.label}
                    inputMode="decimal"
                    value={texts[f.id] ?? (f.value === undefined ? '' : String(f.value))}
                    error={errors[f.id]}
                    hint={f.optional ? (f.path.includes('tonsPerAcre') ? 'Optional; empty asks for the soil-test rate' : 'Optional') : undefined}
                    onChange={(e) => onText(f.id, e.target.value)}
                  />
                ))}
              </div>
            ) : null}
            {step.services?.length ? (
              <div className="mt-2">
                <p className="text-xs font-semibold uppercase tracking-wide text-slate">Services</p>
                <ul className="list-disc pl-5 text-sm text-ink">
                  {step.services.map((s, i) => (
                    <li key={i}>{serviceText(s, rates)}</li>
                  ))}
                </ul>
              </div>
            ) : null}
          </li>
        );
      })}
    </ol>
  );
}
