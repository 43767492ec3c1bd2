import { setPasswordWithToken } from "@/lib/server/accounts";
import { readJson, route } from "@/lib/server/http";
import { setPasswordSchema } from "@/lib/domain/validation/accounts";

/** Sets a password with the token from an invitation or reset mail. */
export const POST = route(async (request) => {
  const input = await readJson(request, setPasswordSchema);
  const user = await setPasswordWithToken(input);
  return Response.json({ user: { email: user?.email } });
});
