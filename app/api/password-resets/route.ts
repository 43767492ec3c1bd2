import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { requestPasswordReset } from "@/lib/server/accounts";
import { throttleResetRequest } from "@/lib/server/auth/sign-in";
import { clientAddress } from "@/lib/server/http";

/** Anyone may ask; the answer is the same whether or not the address has an account. */
export const POST = handle(api.session.requestReset, async ({ request, body: { email } }) => {
  await throttleResetRequest({ email, address: clientAddress(request) });
  await requestPasswordReset({ email });
  return { message: "If that address has an account, a mail with a link to choose a new password is on its way." };
});
