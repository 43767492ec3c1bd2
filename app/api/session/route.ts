import { endSession, getCurrentUser, startSession } from "@/app/_adapters/session";
import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { AppError } from "@/lib/domain/errors";
import { verifySignIn } from "@/lib/server/auth/sign-in";
import { clientAddress } from "@/lib/server/http";

export const GET = handle(api.session.current, async () => {
  const user = await getCurrentUser();
  if (!user) throw new AppError("unauthorized", "Nobody is signed in.");
  return { user };
});

export const POST = handle(api.session.signIn, async ({ request, body }) => {
  const user = await verifySignIn({ ...body, address: clientAddress(request) });
  await startSession(user);
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role } };
});

export const DELETE = handle(api.session.signOut, async () => {
  await endSession();
});
