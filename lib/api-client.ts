/** Browser-side fetch for the JSON API: throws ApiError carrying the server's code and field. */
export class ApiError extends Error {
  constructor(
    message: string,
    public readonly status: number,
    public readonly code: string,
    public readonly field?: string,
    public readonly fields?: { field: string; message: string }[],
    public readonly body?: unknown,
  ) {
    super(message);
  }
  /** Field → message map for inline form errors. */
  fieldMap(): Record<string, string> {
    const m: Record<string, string> = {};
    for (const f of this.fields ?? []) m[f.field] ??= f.message;
    if (this.field && !m[this.field]) m[this.field] = this.message;
    return m;
  }
}

export async function api<T>(path: string, init?: RequestInit & { json?: unknown }): Promise<T> {
  const { json, ...rest } = init ?? {};
  const res = await fetch(path, {
    ...rest,
    headers: { ...(json !== undefined ? { "content-type": "application/json" } : {}), ...(rest.headers ?? {}) },
    body: json !== undefined ? JSON.stringify(json) : rest.body,
  });
  const text = await res.text();
  const data = text ? JSON.parse(text) : {};
  if (!res.ok) {
    const e = data?.error ?? {};
    throw new ApiError(e.message ?? `Request failed (${res.status})`, res.status, e.code ?? "unknown", e.field, e.fields, data);
  }
  return data as T;
}
