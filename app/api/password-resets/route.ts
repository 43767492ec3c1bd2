import { requestPasswordReset } from "@/lib/server/accounts";
import { throttleResetRequest } from "@/lib/server/auth/sign-in";
import { clientAddress, readJson, route } from "@/lib/server/http";
import { passwordResetRequestSchema } from "@/lib/domain/validation/accounts";

/** Anyone may ask; the answer is the same whether or not the address has an account. */
export const POST = route(async (request) => {
  const { email } = await readJson(request, passwordResetRequestSchema);
  await throttleResetRequest({ email, address: clientAddress(request) });
  await requestPasswordReset({ email });
  return Response.json(
    { message: "If that address has an account, a mail with a link to choose a new password is on its way." },
    { status: 202 },
  );
});
