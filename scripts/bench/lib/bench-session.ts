// Signs a bench client in over HTTP the way the browser does: CSRF token first, then the session cookie.
export interface BenchSession {
  cookie: string;
  csrf: string;
}

const cookieHeader = (res: Response) =>
  res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');

/** One sign-in per identity: the sign-in limiter counts attempts per address and e-mail, so callers reuse the cookie. */
export async function signInForBench(base: string, email: string, password: string): Promise<BenchSession> {
  const first = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { cookie: cookieHeader(first), 'x-csrf-token': csrfToken, 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`bench sign-in as ${email} failed: ${res.status} ${await res.text()}`);
  return { cookie: cookieHeader(res), csrf: ((await res.json()) as { csrfToken: string }).csrfToken };
}
