import { useState } from 'react';
import { Button } from '../components/ui';
import { useUpdateWaiting } from './update-state';

/** "Update available — reload": shown when a new build has been fetched and waits to take over. */
export function UpdatePrompt() {
  const apply = useUpdateWaiting();
  const [busy, setBusy] = useState(false);
  if (!apply) return null;
  return (
    <div
      role="status"
      className="fixed inset-x-3 bottom-3 z-50 mx-auto flex max-w-md items-center gap-3 rounded-lg border border-paper-line bg-white px-4 py-3 text-sm shadow-lg"
    >
      <span className="flex-1">A new version of Quiltline is ready. Reload to use it — anything queued on this device is kept.</span>
      <Button
        size="sm"
        busy={busy}
        onClick={() => {
          setBusy(true);
          void apply();
        }}
      >
        Reload
      </Button>
    </div>
  );
}
