import { expect, request as apiRequest, type APIRequestContext } from "@playwright/test";
import { demoPassword } from "./pages/sign-in";

const baseURL = process.env.HL_BASE_URL ?? "http://localhost:3000";

/** A signed-in API session of a demo account, for setting up what a test then does in the browser. */
export async function apiAs(email: string): Promise<APIRequestContext> {
  const context = await apiRequest.newContext({ baseURL });
  const answer = await context.post("/api/session", { data: { email, password: demoPassword } });
  expect(answer.status()).toBe(200);
  return context;
}
