import { useState } from 'react';
import { authClient } from './client';

export default function SignOutButton() {
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      className="btn-secondary"
      disabled={busy}
      onClick={async () => {
        setBusy(true);
        await authClient.signOut().catch(() => undefined);
        window.location.href = '/sign-in';
      }}
    >
      Sign out
    </button>
  );
}
