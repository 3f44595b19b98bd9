/**
 * The proposal builder's form state: the draft's fields and lines, what the person touched, the
 * server's field errors, the live check (errors and totals by the server's own rule), and the edits
 * (a field, a line, add or remove a line).
 */
import { useMemo, useRef, useState } from 'react';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { checkDraft, draftFormFrom, groupDraftLines, insertIntoGroup, lineField, newDraftLine, type DraftForm, type DraftLine, type FieldErrors } from '../utils/draft-form';

/** The builder's form for one draft proposal. */
export function useDraftForm(proposal: ProposalDto) {
  const [form, setForm] = useState<DraftForm>(() => draftFormFrom(proposal));
  const [baseline, setBaseline] = useState(() => JSON.stringify(draftFormFrom(proposal)));
  const [serverErrors, setServerErrors] = useState<FieldErrors>({});
  const [touched, setTouched] = useState<ReadonlySet<string>>(new Set());
  const [attempted, setAttempted] = useState(false);
  const [focusKey, setFocusKey] = useState<string | null>(null);
  const nextKey = useRef(1);

  const check = useMemo(() => checkDraft(form), [form]);
  const dirty = JSON.stringify(form) !== baseline;
  const groups = useMemo(() => groupDraftLines(form.lines), [form.lines]);

  /** The problem to show beside a field: the server's, or the form's own once touched or after a save attempt. */
  const errorOf = (key: string): string | undefined => serverErrors[key] ?? (attempted || touched.has(key) ? check.errors[key] : undefined);
  const touch = (key: string) => setTouched((prev) => (prev.has(key) ? prev : new Set(prev).add(key)));
  const clearServer = (...keys: string[]) =>
    setServerErrors((prev) => {
      if (!keys.some((k) => k in prev)) return prev;
      const next = { ...prev };
      for (const k of keys) delete next[k];
      return next;
    });
  const setField = <K extends keyof DraftForm>(name: K, value: DraftForm[K]) => {
    setForm((f) => ({ ...f, [name]: value }));
    clearServer(name === 'discountPercent' || name === 'discountDollars' || name === 'discountKind' ? 'discount' : name);
  };
  const setLine = (key: string, patch: Partial<DraftLine>) => {
    setForm((f) => ({ ...f, lines: f.lines.map((l) => (l.key === key ? { ...l, ...patch } : l)) }));
    clearServer(...Object.keys(patch).map((k) => lineField(key, k as keyof DraftLine)), lineField(key, 'line'));
  };
  const removeLine = (key: string) => setForm((f) => ({ ...f, lines: f.lines.filter((l) => l.key !== key) }));
  const addLine = (groupLabel: string, unitId: number | null) => {
    const key = `new-${nextKey.current++}`;
    setForm((f) => ({ ...f, lines: insertIntoGroup(f.lines, newDraftLine(key, groupLabel, unitId)) }));
    setFocusKey(key);
  };
  /** After a save: the server's answer becomes the form, with nothing marked. */
  const resetTo = (saved: ProposalDto) => {
    const next = draftFormFrom(saved);
    setForm(next);
    setBaseline(JSON.stringify(next));
    setServerErrors({});
    setTouched(new Set());
    setAttempted(false);
  };
  /** Takes the form as it is as the saved state (after a withdraw, nothing is left to save). */
  const markClean = () => setBaseline(JSON.stringify(form));

  return { form, check, dirty, groups, attempted, setAttempted, focusKey, errorOf, touch, setField, setLine, removeLine, addLine, setServerErrors, resetTo, markClean };
}

/** What useDraftForm gives. */
export type DraftFormState = ReturnType<typeof useDraftForm>;
