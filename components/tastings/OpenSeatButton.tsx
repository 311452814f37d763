'use client';

import { useState } from 'react';
import { renewMySeatAction } from '@/lib/tastings/actions';
import { Button } from '@/components/ui/Button';

/** Opens the signed-in taster's own seat with a fresh link (the e-mailed one stops working). */
export function OpenSeatButton({ tastingId }: { tastingId: string }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string>();
  async function open() {
    setBusy(true);
    setError(undefined);
    try {
      const res = await renewMySeatAction(tastingId);
      if (res.ok) {
        window.location.assign(res.data.path);
        return;
      }
      setError(res.error);
    } catch {
      setError('No connection: check the network and try again.');
    }
    setBusy(false);
  }
  return (
    <div>
      <Button type="button" onClick={open} disabled={busy}>{busy ? 'Opening…' : 'Open my seat'}</Button>
      {error ? <p role="alert" className="mt-1 text-sm text-ember-700">{error}</p> : null}
    </div>
  );
}
