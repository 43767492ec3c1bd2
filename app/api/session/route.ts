import { verifySignIn } from "@/lib/server/auth/sign-in";
import { endSession, getCurrentUser, startSession } from "@/app/_adapters/session";
import { AppError } from "@/lib/domain/errors";
import { clientAddress, readJson, route } from "@/lib/server/http";
import { signInSchema } from "@/lib/domain/validation/accounts";

export const GET = route(async () => {
  const user = await getCurrentUser();
  if (!user) throw new AppError("unauthorized", "Nobody is signed in.");
  return Response.json({ user });
});

export const POST = route(async (request) => {
  const input = await readJson(request, signInSchema);
  const user = await verifySignIn({ ...input, address: clientAddress(request) });
  await startSession(user);
  return Response.json({ user: { id: user.id, email: user.email, name: user.name, role: user.role } });
});

export const DELETE = route(async () => {
  await endSession();
  return new Response(null, { status: 204 });
});
