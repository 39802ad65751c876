// Browser-side calls to the JSON route handlers: checks each response with a zod schema and turns the
// API's error body (`{ error: { code, message, fields } }`) into an ApiError a form can show.
import { z } from "zod";

const errorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
  }),
});

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
    this.name = "ApiError";
  }
}

export interface ApiRequest<T> {
  method?: "GET" | "POST" | "PUT" | "DELETE";
  body?: unknown;
  /** Schema of a successful response body; omit for 204 No Content. */
  schema?: z.ZodType<T>;
}

export async function apiFetch<T = void>(url: string, { method = "GET", body, schema }: ApiRequest<T> = {}): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, {
      method,
      headers: body === undefined ? undefined : { "content-type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: "same-origin",
    });
  } catch {
    throw new ApiError(0, "network", "Could not reach the server. Check the connection and try again.");
  }
  const text = await response.text();
  const json: unknown = text ? safeJson(text) : undefined;
  if (!response.ok) throw toApiError(response.status, json);
  if (!schema) return undefined as T;
  const parsed = schema.safeParse(json);
  if (!parsed.success) throw new ApiError(response.status, "bad_response", "The server sent an answer this page does not understand.");
  return parsed.data;
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

function toApiError(status: number, json: unknown): ApiError {
  const parsed = errorBodySchema.safeParse(json);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiError(status, code, message, fields);
  }
  return new ApiError(status, "unknown", `The server answered with status ${status}. Try again in a moment.`);
}

/** Puts an API error on the form: on its fields when the server named them, otherwise as a form message. */
export function applyApiError<Name extends string>(
  error: unknown,
  setFieldError: (name: Name, error: { type: string; message: string }) => void,
  fieldNames: readonly Name[],
  setFormError: (message: string) => void,
): void {
  if (!(error instanceof ApiError)) {
    setFormError(error instanceof Error ? error.message : "Something went wrong. Try again.");
    return;
  }
  const known = Object.entries(error.fields).filter(([name]) => (fieldNames as readonly string[]).includes(name));
  for (const [name, message] of known) setFieldError(name as Name, { type: "server", message });
  if (known.length === 0) setFormError(error.message);
}
