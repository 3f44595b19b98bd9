import { useState } from 'react';
import type { UseMutationResult } from '@tanstack/react-query';
import { Button } from '../../../components/ui/button';
import { TextButton } from '../../../components/ui/text-button';
import { useToast } from '../../../components/ui/toast';

/** "Archive" that asks once ("Archive it" / "Keep") before archiving a library entry. */
export function ArchiveControl({ id, name, archive }: { id: number; name: string; archive: UseMutationResult<void, Error, number> }) {
  const toast = useToast();
  const [confirming, setConfirming] = useState(false);
  if (!confirming) {
    return (
      <TextButton tone="clay" aria-label={`Archive ${name}`} onClick={() => setConfirming(true)}>
        Archive
      </TextButton>
    );
  }
  return (
    <span className="inline-flex items-center gap-1">
      <Button
        type="button"
        variant="danger"
        busy={archive.isPending}
        onClick={() =>
          archive.mutate(id, {
            onSuccess: () => toast('success', `${name} archived.`),
            onError: (e) => {
              toast('error', e.message);
              setConfirming(false);
            },
          })
        }
      >
        Archive it
      </Button>
      <TextButton onClick={() => setConfirming(false)}>Keep</TextButton>
    </span>
  );
}
