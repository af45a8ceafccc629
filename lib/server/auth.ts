import crypto from "node:crypto";
import { getDb } from "@/db/index";
import type { Role } from "@/db/schema";
import { findAuthToken, insertAuthToken, useAuthToken } from "@/db/queries/auth-tokens";
import { findUserByEmail, findUserById, insertUser, updateUser } from "@/db/queries/users";
import { ApiError, isUniqueViolation } from "./http";
import { appUrl, sendMail } from "./mail";
import { dummyPasswordHash, hashPassword, verifyPassword } from "./password";
import { noteSignInFailure, noteSignInSuccess, signInBlocked } from "./rate-limit";
import { endAllSessionsOf } from "./session";

export const INVITE_TTL_S = 72 * 3600;
export const RESET_TTL_S = 3600;

const now = () => Math.floor(Date.now() / 1000);
const sha256 = (s: string) => crypto.createHash("sha256").update(s).digest("hex");

/** Checks credentials; the same error for unknown user and wrong password. */
export async function checkCredentials(email: string, password: string, address: string) {
  const db = await getDb();
  const t = now();
  if (await signInBlocked(db, email, address, t)) {
    throw new ApiError(429, "rate_limited", "Too many failed sign-ins. Wait 15 minutes and try again, or reset your password.");
  }
  const user = await findUserByEmail(db, email);
  const ok = user?.password_hash
    ? await verifyPassword(user.password_hash, password)
    : (await verifyPassword(await dummyPasswordHash(), password), false);
  if (!user || !ok || !user.active) {
    await noteSignInFailure(db, email, address, t);
    throw new ApiError(401, "unauthenticated", "Wrong e-mail address or password.");
  }
  await noteSignInSuccess(db, email);
  return user;
}

async function issueToken(userId: string, kind: "invite" | "reset", ttl: number): Promise<string> {
  const token = crypto.randomBytes(32).toString("base64url");
  const t = now();
  await insertAuthToken(await getDb(), { id: sha256(token), user_id: userId, kind, expires_at: t + ttl, used_at: null, created_at: t });
  return token;
}

export async function inviteUser(input: { email: string; name: string; role: Role }, request: Request) {
  const db = await getDb();
  const id = crypto.randomUUID();
  try {
    await insertUser(db, {
      id,
      email: input.email,
      name: input.name,
      role: input.role,
      password_hash: null,
      active: 1,
      unit_system: "metric",
      created_at: now(),
    });
  } catch (e) {
    if (isUniqueViolation(e)) {
      throw new ApiError(409, "conflict", `A user with ${input.email} already exists.`, { email: "Already in use." });
    }
    throw e;
  }
  const token = await issueToken(id, "invite", INVITE_TTL_S);
  await sendMail({
    to: input.email,
    subject: "Your Coatwright account",
    text:
      `Hello ${input.name},\n\nYou have been given a Coatwright account (${input.role}).\n` +
      `Set your password here within 72 hours:\n\n${appUrl(request)}/invite/${token}\n\n` +
      `The link works once.\n`,
  });
  return { id };
}

/** A reset link is mailed only to an existing, active account; the answer is the same either way. */
export async function requestPasswordReset(email: string, request: Request): Promise<void> {
  const user = await findUserByEmail(await getDb(), email);
  if (!user || !user.active) return;
  const token = await issueToken(user.id, "reset", RESET_TTL_S);
  await sendMail({
    to: user.email,
    subject: "Reset your Coatwright password",
    text:
      `Someone (hopefully you) asked to reset the password of ${user.email}.\n` +
      `Choose a new password here within one hour:\n\n${appUrl(request)}/reset-password/${token}\n\n` +
      `The link works once. If you did not ask, ignore this message.\n`,
  });
}

export type TokenState = "valid" | "expired" | "used" | "unknown";

export async function tokenState(token: string, kind: "invite" | "reset"): Promise<TokenState> {
  const row = await findAuthToken(await getDb(), sha256(token));
  if (!row || row.kind !== kind) return "unknown";
  if (row.used_at !== null) return "used";
  if (row.expires_at <= now()) return "expired";
  return "valid";
}

const tokenMessages: Record<Exclude<TokenState, "valid">, string> = {
  unknown: "This link is not valid. Ask for a new one.",
  expired: "This link has expired. Ask for a new one.",
  used: "This link has already been used. Ask for a new one.",
};

/** Sets the password through a one-time token; the token is spent in the same transaction. */
export async function setPasswordWithToken(token: string, kind: "invite" | "reset", password: string) {
  const state = await tokenState(token, kind);
  if (state !== "valid") throw new ApiError(400, "invalid_input", tokenMessages[state], { token: tokenMessages[state] });
  const passwordHash = await hashPassword(password);
  const db = await getDb();
  const id = sha256(token);
  const userId = await db.transaction().execute(async (trx) => {
    const row = await findAuthToken(trx, id);
    if (!row || !(await useAuthToken(trx, id, now()))) return null;
    await updateUser(trx, row.user_id, { password_hash: passwordHash });
    return row.user_id;
  });
  if (!userId) throw new ApiError(400, "invalid_input", tokenMessages.used, { token: tokenMessages.used });
  // A reset ends every open session of the account.
  if (kind === "reset") await endAllSessionsOf(userId);
  return (await findUserById(db, userId))!;
}
