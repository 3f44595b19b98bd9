import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { TaskSkipSchema } from '../../../../shared/schemas/task';
import { Button } from '../../../components/ui/button';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { useToast } from '../../../components/ui/toast';
import { sentence } from '../../../lib/api-errors';
import { useSkipTask } from '../api/skip-task';
import type { FieldTask } from '../api/get-my-tasks';

/** Skip a task with a reason (needs a connection: the consultant has to know now). */
export function SkipForm({ task, onCancel }: { task: FieldTask; onCancel: () => void }) {
  const skip = useSkipTask();
  const toast = useToast();
  const form = useForm<z.input<typeof TaskSkipSchema>, unknown, z.output<typeof TaskSkipSchema>>({ resolver: zodResolver(TaskSkipSchema), defaultValues: { reason: '' } });
  const onSubmit = form.handleSubmit(async ({ reason }) => {
    try {
      await skip.mutateAsync({ id: task.id, reason });
      toast('success', `“${task.name}” skipped.`);
      onCancel();
    } catch (err) {
      form.setError('reason', { message: err instanceof Error ? err.message : 'The skip could not be saved. Try again.' });
    }
  });
  const error = form.formState.errors.reason?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3" aria-label="Skip this task">
      <TextAreaField label="Why are you skipping it?" rows={3} placeholder="e.g. Standing water; too wet to work" {...form.register('reason')} error={error ? sentence(error) : undefined} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" variant="danger" busy={skip.isPending} className="min-h-12">
          Skip task
        </Button>
        <Button type="button" variant="secondary" onClick={onCancel} className="min-h-12">
          Cancel
        </Button>
      </div>
    </form>
  );
}
