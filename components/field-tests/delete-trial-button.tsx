'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/form';

export function DeleteTrialButton({ testId, trialId }: { testId: string; trialId: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  return (
    <div>
      <Button
        type="button"
        variant="danger"
        onClick={async () => {
          const res = await fetch(`/api/v1/field-tests/${encodeURIComponent(testId)}/trials/${encodeURIComponent(trialId)}`, { method: 'DELETE' });
          if (res.ok) router.refresh();
          else setError(((await res.json().catch(() => null)) as { error?: { message: string } } | null)?.error?.message ?? 'The trial could not be deleted.');
        }}
      >
        Delete this trial
      </Button>
      {error ? <p className="text-sm text-danger">{error}</p> : null}
    </div>
  );
}
