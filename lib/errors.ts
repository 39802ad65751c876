// Typed API errors (`forbidden:set`, `bad_request:invitation` …) and the one function that turns any error into a Response.
import { z } from "zod";

export type ErrorKind =
  | "bad_request"
  | "unauthorized"
  | "payment_required"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "gone"
  | "too_large"
  | "rate_limited"
  | "unavailable";

export type ErrorCode = `${ErrorKind}:${string}`;

const STATUS: Record<ErrorKind, number> = {
  bad_request: 400,
  unauthorized: 401,
  payment_required: 402,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  gone: 410,
  too_large: 413,
  rate_limited: 429,
  unavailable: 503,
};

export interface ErrorBody {
  error: { code: ErrorCode | "internal:server"; message: string; fields?: Record<string, string> };
}

export class ApiError extends Error {
  readonly code: ErrorCode;
  readonly status: number;
  readonly fields?: Record<string, string>;

  constructor(code: ErrorCode, message: string, fields?: Record<string, string>) {
    super(message);
    this.name = "ApiError";
    this.code = code;
    this.status = STATUS[code.split(":")[0] as ErrorKind];
    this.fields = fields;
  }

  toResponse(): Response {
    const body: ErrorBody = { error: { code: this.code, message: this.message, ...(this.fields && { fields: this.fields }) } };
    return Response.json(body, { status: this.status });
  }
}

/** First message per field, keyed by the dotted path (`emails.2`, `oneRepMaxes.squat`). */
export function fieldMessages(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length > 0 ? issue.path.map(String).join(".") : "_";
    fields[key] ??= issue.message;
  }
  return fields;
}

export function validationError(resource: string, error: z.ZodError): ApiError {
  const fields = fieldMessages(error);
  const first = Object.values(fields)[0] ?? "The request is not valid.";
  return new ApiError(`bad_request:${resource}`, `Please check the form: ${first}`, fields);
}

/** Parses with a schema or throws a 400 naming each bad field. */
export function parseOrThrow<S extends z.ZodType>(schema: S, input: unknown, resource: string): z.output<S> {
  const result = schema.safeParse(input);
  if (!result.success) throw validationError(resource, result.error);
  return result.data;
}

/** Largest JSON body a route reads unless it says otherwise: every form here is a few kilobytes (common practice). */
export const DEFAULT_JSON_LIMIT_BYTES = 256 * 1024;

function tooLarge(resource: string, limitBytes: number): ApiError {
  return new ApiError(`too_large:${resource}`, `The request is larger than ${Math.round(limitBytes / 1024)} KB.`);
}

/** The body as UTF-8 text, reading no further than the limit (a missing or lying Content-Length changes nothing). */
async function readText(request: Request, resource: string, limitBytes: number): Promise<string> {
  if (Number(request.headers.get("content-length") ?? 0) > limitBytes) throw tooLarge(resource, limitBytes);
  if (!request.body) return "";
  const reader = request.body.getReader();
  const decoder = new TextDecoder("utf-8", { fatal: true });
  const pieces: string[] = [];
  let total = 0;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      if (total > limitBytes) {
        await reader.cancel();
        throw tooLarge(resource, limitBytes);
      }
      pieces.push(decoder.decode(value, { stream: true }));
    }
    pieces.push(decoder.decode());
  } catch (error) {
    if (error instanceof ApiError) throw error;
    throw new ApiError(`bad_request:${resource}`, "The request body must be UTF-8 text.");
  }
  return pieces.join("");
}

/**
 * The path of the first string (value or key) PostgreSQL could not store as it was sent: a NUL character,
 * or a lone UTF-16 surrogate that JSON allows as an escape but UTF-8 cannot encode. Null when all are fine.
 */
export function findUnstorableText(value: unknown): string | null {
  const stack: { value: unknown; path: string }[] = [{ value, path: "" }];
  const bad = (text: string) => text.includes("\u0000") || !text.isWellFormed();
  while (stack.length > 0) {
    const { value: current, path } = stack.pop() as { value: unknown; path: string };
    if (typeof current === "string") {
      if (bad(current)) return path || "_";
    } else if (Array.isArray(current)) {
      for (let i = current.length - 1; i >= 0; i--) stack.push({ value: current[i], path: path ? `${path}.${i}` : String(i) });
    } else if (current !== null && typeof current === "object") {
      for (const [key, item] of Object.entries(current)) {
        const at = path ? `${path}.${key}` : key;
        if (bad(key)) return at;
        stack.push({ value: item, path: at });
      }
    }
  }
  return null;
}

/**
 * Reads a JSON body: a missing, malformed, oversized or non-UTF-8 body is a 4xx, never a crash, and text
 * that could not be stored verbatim (NUL, lone surrogates) is refused here for every route at once.
 */
export async function readJson(request: Request, resource: string, limitBytes = DEFAULT_JSON_LIMIT_BYTES): Promise<unknown> {
  const text = await readText(request, resource, limitBytes);
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw new ApiError(`bad_request:${resource}`, "The request body must be JSON.");
  }
  // The text decoded as strict UTF-8 and JSON allows no raw control characters, so NUL and lone surrogates
  // can only arrive as \u escapes: a body without any (nearly all of them) needs no walk through its values.
  const unstorable = text.includes("\\u") ? findUnstorableText(value) : null;
  if (unstorable !== null) {
    const message = "Text may not contain NUL characters or broken Unicode (lone surrogates).";
    throw new ApiError(`bad_request:${resource}`, `Please check the form: ${message}`, { [unstorable]: message });
  }
  return value;
}

/** Any thrown value becomes a JSON error response; unexpected ones are logged and hidden behind a 500. */
export function toErrorResponse(error: unknown): Response {
  if (error instanceof ApiError) return error.toResponse();
  console.error(error);
  const body: ErrorBody = { error: { code: "internal:server", message: "Something went wrong on our side. Please try again." } };
  return Response.json(body, { status: 500 });
}

/** Wraps a route handler so every thrown error leaves as a JSON error response. */
export function withErrors<Context>(
  handler: (request: Request, context: Context) => Promise<Response>,
): (request: Request, context: Context) => Promise<Response> {
  return async (request, context) => {
    try {
      return await handler(request, context);
    } catch (error) {
      return toErrorResponse(error);
    }
  };
}
