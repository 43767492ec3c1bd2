// The session cookie's name, on its own so the proxy (which runs without the database) shares it.
export const sessionCookieName = "hangarleaf_session";
