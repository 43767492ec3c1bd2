import { setPasswordWithToken } from "@/lib/accounts";
import { readJson, route } from "@/lib/http";
import { setPasswordSchema } from "@/lib/validation/accounts";

/** Sets a password with the token from an invitation or reset mail. */
export const POST = route(async (request) => {
  const input = await readJson(request, setPasswordSchema);
  const user = await setPasswordWithToken(input);
  return Response.json({ user: { email: user?.email } });
});
