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

/** Reads a JSON body; a missing or malformed body is a 400, not a crash. */
export async function readJson(request: Request, resource: string): Promise<unknown> {
  try {
    return await request.json();
  } catch {
    throw new ApiError(`bad_request:${resource}`, "The request body must be JSON.");
  }
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
