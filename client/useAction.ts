// The busy flag and error message every form needs around one async action.
import { useCallback, useState } from 'react';

export function useAction(action: () => Promise<void>) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const run = useCallback(async () => {
    setError(null);
    setBusy(true);
    try {
      await action();
    } catch (e) {
      setError((e as Error).message);
    } finally {
      setBusy(false);
    }
  }, [action]);
  return { run, busy, error, setError };
}
