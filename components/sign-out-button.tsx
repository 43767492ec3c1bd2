"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { call } from "@/lib/client/api";
import { cartData, syncer } from "@/lib/client/cart/cart";
import { forgetUser, lastUser, markSignOutPending } from "@/lib/client/cart/store";
import { sessionApi } from "@/lib/contracts/endpoints/session";

/**
 * Signing out on a shared cart: waiting changes are sent first when possible, then this user's
 * stored runs, notes and pages are deleted, so the next student sees none of them.
 */
export function SignOutButton() {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      className="btn btn-secondary btn-small"
      disabled={busy}
      onClick={async () => {
        setBusy(true);
        // The account signing out, as the server knows it (offline: the one the cart opened for).
        const user = await call(sessionApi.current)
          .then((r) => r.user)
          .catch(() => lastUser().catch(() => undefined));
        if (user) {
          const data = cartData(user.id);
          await syncer(data)
            .now()
            .catch(() => null);
          const waiting = (await data.pending()).length + (await data.pendingPhotos()).length;
          if (
            waiting &&
            !window.confirm(
              `${waiting} ${waiting === 1 ? "change has" : "changes have"} not reached the school yet. Signing out now deletes ${waiting === 1 ? "it" : "them"} from this laptop. Sign out anyway?`,
            )
          ) {
            setBusy(false);
            return;
          }
          await forgetUser(user.id);
        }
        // Offline the cookie cannot be ended now: the cart ends it before anything else next time
        // it reaches the server, so the next person never continues in this account.
        await call(sessionApi.signOut).catch(() => markSignOutPending());
        router.replace("/sign-in");
        router.refresh();
      }}
    >
      Sign out
    </button>
  );
}
