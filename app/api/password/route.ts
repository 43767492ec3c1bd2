import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { setPasswordWithToken } from "@/lib/server/accounts";

/** Sets a password with the token from an invitation or reset mail. */
export const POST = handle(api.session.setPassword, async ({ body }) => {
  const user = await setPasswordWithToken(body);
  return { user: { email: user?.email } };
});
