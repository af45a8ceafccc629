import { z } from "zod";
import { apiAccess, allows, type Method } from "./access";
import { sessionFromRequest, type SessionUser } from "./session";

export type ErrorCode =
  | "invalid_input"
  | "unauthenticated"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "too_large"
  | "rate_limited"
  | "server_error";

/** Thrown anywhere below a route handler to answer with the one error shape. */
export class ApiError extends Error {
  constructor(
    public status: number,
    public code: ErrorCode,
    message: string,
    public fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export function errorResponse(status: number, code: ErrorCode, message: string, fields?: Record<string, string>) {
  return Response.json({ error: fields ? { code, message, fields } : { code, message } }, { status });
}

/** zod issues → { "part.massKg": "message" }; unknown keys are named one by one. */
export function zodFields(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const base = issue.path.map(String).join(".");
    if (issue.code === "unrecognized_keys") {
      for (const k of issue.keys) fields[base ? `${base}.${k}` : k] ??= "Unknown field.";
    } else {
      fields[base || "body"] ??= issue.message;
    }
  }
  return fields;
}

export function invalidInput(error: z.ZodError): ApiError {
  const fields = zodFields(error);
  const first = Object.entries(fields)[0];
  return new ApiError(400, "invalid_input", first ? `${first[0]}: ${first[1]}` : "Invalid input.", fields);
}

const MAX_JSON_BYTES = 1_000_000;

/** Reads and validates a JSON body: malformed JSON, too large or schema-invalid → ApiError. */
export async function readJson<S extends z.ZodType>(request: Request, schema: S): Promise<z.infer<S>> {
  const length = Number(request.headers.get("content-length") ?? "0");
  if (length > MAX_JSON_BYTES) throw new ApiError(413, "too_large", "The request body is larger than 1 MB.");
  const text = await request.text();
  if (text.length > MAX_JSON_BYTES) throw new ApiError(413, "too_large", "The request body is larger than 1 MB.");
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    throw new ApiError(400, "invalid_input", "The request body is not valid JSON.", { body: "Send a JSON object." });
  }
  const parsed = schema.safeParse(data);
  if (!parsed.success) throw invalidInput(parsed.error);
  return parsed.data;
}

// NOTE: Next protects server actions against cross-site posts, not route handlers: a browser
// request whose Origin names another host is refused before any work is done.
function foreignOrigin(request: Request): boolean {
  const origin = request.headers.get("origin");
  if (!origin) return false;
  const host = request.headers.get("x-forwarded-host") ?? request.headers.get("host");
  try {
    return new URL(origin).host !== host;
  } catch {
    return true;
  }
}

export interface RouteContext<P> {
  request: Request;
  user: SessionUser;
  params: P;
}

type Handler<P> = (ctx: RouteContext<P>) => Promise<Response>;
type PublicHandler<P> = (ctx: { request: Request; user: SessionUser | null; params: P }) => Promise<Response>;

/** Domain errors thrown by the pure libraries carry the field they refer to. */
function isDomainError(e: unknown): e is Error & { field: string } {
  return e instanceof Error && typeof (e as { field?: unknown }).field === "string";
}

/**
 * Wraps a route handler: access row lookup (a missing row fails at load, so nothing is open by
 * accident), Origin check, session, role, and one error shape for everything thrown below.
 */
function wrap<P>(path: string, method: Method, handler: PublicHandler<P>) {
  const access = apiAccess[path]?.[method];
  if (!access) throw new Error(`No access row for ${method} ${path} in lib/server/access.ts`);
  return async (request: Request, context?: { params?: Promise<P> }): Promise<Response> => {
    try {
      if (method !== "GET" && foreignOrigin(request)) {
        return errorResponse(403, "forbidden", "Requests from another site are not accepted.");
      }
      const session = access === "public" && path.startsWith("/api/auth/") ? null : await sessionFromRequest(request);
      if (!allows(access, session?.user.role ?? null)) {
        return session
          ? errorResponse(403, "forbidden", `The ${session.user.role} role may not ${method} ${path}.`)
          : errorResponse(401, "unauthenticated", "Sign in first.");
      }
      const params = ((await context?.params) ?? {}) as P;
      const response = await handler({ request, user: session?.user ?? null, params });
      if (session?.setCookie && !response.headers.has("set-cookie")) {
        response.headers.append("set-cookie", session.setCookie);
      }
      return response;
    } catch (e) {
      return toErrorResponse(e);
    }
  };
}

/** A route that needs a session; the access table says which roles. */
export function route<P = Record<string, never>>(path: string, method: Method, handler: Handler<P>) {
  if (apiAccess[path]?.[method] === "public") throw new Error(`${method} ${path} is public: use publicRoute`);
  return wrap<P>(path, method, handler as PublicHandler<P>);
}

/** A route that answers without a session (sign-in, reset, health…). */
export function publicRoute<P = Record<string, never>>(path: string, method: Method, handler: PublicHandler<P>) {
  if (apiAccess[path]?.[method] !== "public") throw new Error(`${method} ${path} is not public in the access table`);
  return wrap<P>(path, method, handler);
}

export function toErrorResponse(e: unknown): Response {
  if (e instanceof ApiError) return errorResponse(e.status, e.code, e.message, e.fields);
  if (e instanceof z.ZodError) {
    const err = invalidInput(e);
    return errorResponse(400, err.code, err.message, err.fields);
  }
  if (isDomainError(e)) return errorResponse(400, "invalid_input", e.message, { [e.field]: e.message });
  if (isUniqueViolation(e)) return errorResponse(409, "conflict", "That record already exists.");
  // NOTE: the details stay in the server log; the client gets no stack trace or SQL.
  console.error(e);
  return errorResponse(500, "server_error", "Something went wrong on the server; the error was logged.");
}

export function isUniqueViolation(e: unknown): boolean {
  return e instanceof Error && (e as { code?: string }).code === "SQLITE_CONSTRAINT_UNIQUE";
}

/** Helpers for handlers. */
export function json(data: unknown, init?: ResponseInit): Response {
  return Response.json(data, init);
}
