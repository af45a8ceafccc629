import type { Db } from "@/db/index";
import { countFailuresSince, clearFailures, pruneFailures, recordFailure } from "@/db/queries/sign-in-failures";

// 10 failures in 15 minutes per account and per client address, then refuse until the window passes.
export const SIGN_IN_WINDOW_S = 15 * 60;
export const SIGN_IN_MAX_FAILURES = 10;

export function clientAddress(request: Request): string {
  // Behind a reverse proxy the first X-Forwarded-For hop is the client; direct, Next gives no socket address.
  return request.headers.get("x-forwarded-for")?.split(",")[0]?.trim() || request.headers.get("x-real-ip") || "local";
}

function keys(email: string, address: string): string[] {
  return [`account:${email.toLowerCase()}`, `address:${address}`];
}

export async function signInBlocked(db: Db, email: string, address: string, now: number): Promise<boolean> {
  for (const k of keys(email, address)) {
    if ((await countFailuresSince(db, k, now - SIGN_IN_WINDOW_S)) >= SIGN_IN_MAX_FAILURES) return true;
  }
  return false;
}

export async function noteSignInFailure(db: Db, email: string, address: string, now: number): Promise<void> {
  await recordFailure(db, keys(email, address), now);
  await pruneFailures(db, now - SIGN_IN_WINDOW_S);
}

export async function noteSignInSuccess(db: Db, email: string): Promise<void> {
  await clearFailures(db, `account:${email.toLowerCase()}`);
}
