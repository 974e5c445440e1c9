import type { MeResponse, SignedInResponse } from '@rampart/collab/api/accounts';

/** One answer of the API: status, parsed JSON body (undefined when empty) and headers. */
export interface ApiResponse<T = unknown> {
  status: number;
  body: T;
  headers: Headers;
}

export interface RequestOptions {
  /** Send no CSRF header even on a state-changing request (to test the refusal). */
  withoutCsrf?: boolean;
  /** Raw body text instead of JSON.stringify(body) (oversized or malformed bodies). */
  rawBody?: string;
  headers?: Record<string, string>;
}

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * A small browser stand-in for tests: keeps cookies like a browser would (per name, for one
 * origin), fetches the CSRF token once per session and sends it as `x-csrf-token` on every
 * state-changing request, and follows the token rotation at sign-in and password change.
 *
 * ```ts
 * const owner = new ApiClient(server.url);
 * await owner.signIn('olivia.owner@rampart.test', 'rampart-demo');
 * const res = await owner.get<MeResponse>('/api/auth/me');
 * ```
 */
export class ApiClient {
  /** Cookie name → value. Public so tests can tamper with them. */
  readonly cookies = new Map<string, string>();
  private _csrf?: string;

  constructor(readonly baseUrl: string) {}

  /** The `Cookie` header this client sends. */
  get cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  get<T = unknown>(path: string, options?: RequestOptions): Promise<ApiResponse<T>> {
    return this.request<T>('GET', path, undefined, options);
  }
  post<T = unknown>(
    path: string,
    body?: unknown,
    options?: RequestOptions,
  ): Promise<ApiResponse<T>> {
    return this.request<T>('POST', path, body, options);
  }
  put<T = unknown>(
    path: string,
    body?: unknown,
    options?: RequestOptions,
  ): Promise<ApiResponse<T>> {
    return this.request<T>('PUT', path, body, options);
  }
  patch<T = unknown>(
    path: string,
    body?: unknown,
    options?: RequestOptions,
  ): Promise<ApiResponse<T>> {
    return this.request<T>('PATCH', path, body, options);
  }
  delete<T = unknown>(path: string, options?: RequestOptions): Promise<ApiResponse<T>> {
    return this.request<T>('DELETE', path, undefined, options);
  }

  /** The session's CSRF token (fetched from `GET /api/auth/csrf` when not known yet). */
  async csrfToken(): Promise<string> {
    if (!this._csrf) {
      const res = await this.get<{ token: string }>('/api/auth/csrf');
      if (res.status !== 200) throw new Error(`GET /api/auth/csrf → ${res.status}`);
      this._csrf = res.body.token;
    }
    return this._csrf;
  }

  /** Forget the CSRF token (e.g. after the server rotated the session some other way). */
  forgetCsrfToken(): void {
    this._csrf = undefined;
  }

  async request<T = unknown>(
    method: string,
    path: string,
    body?: unknown,
    options: RequestOptions = {},
  ): Promise<ApiResponse<T>> {
    const headers: Record<string, string> = { accept: 'application/json', ...options.headers };
    if (STATE_CHANGING.has(method) && !options.withoutCsrf) {
      headers['x-csrf-token'] = await this.csrfToken();
    }
    const payload = options.rawBody ?? (body === undefined ? undefined : JSON.stringify(body));
    if (payload !== undefined) headers['content-type'] ??= 'application/json';
    if (this.cookies.size) headers['cookie'] = this.cookieHeader;
    const res = await fetch(new URL(path, this.baseUrl), {
      method,
      headers,
      body: payload,
      redirect: 'manual',
    });
    this._keepCookies(res.headers);
    const text = await res.text();
    let parsed: unknown = undefined;
    if (text) {
      try {
        parsed = JSON.parse(text);
      } catch {
        parsed = text;
      }
    }
    const rotated = res.headers.get('x-csrf-token');
    if (rotated) this._csrf = rotated;
    const token = (parsed as Partial<SignedInResponse> | undefined)?.csrfToken;
    if (typeof token === 'string') this._csrf = token;
    return { status: res.status, body: parsed as T, headers: res.headers };
  }

  /** Registers (and is then signed in). Throws unless 201. */
  async register(email: string, password: string, name?: string): Promise<SignedInResponse> {
    const res = await this.post<SignedInResponse>('/api/auth/register', { email, password, name });
    if (res.status !== 201)
      throw new Error(`register ${email} → ${res.status} ${JSON.stringify(res.body)}`);
    return res.body;
  }

  /** Signs in. Throws unless 200. */
  async signIn(email: string, password: string): Promise<SignedInResponse> {
    const res = await this.post<SignedInResponse>('/api/auth/sign-in', { email, password });
    if (res.status !== 200)
      throw new Error(`sign-in ${email} → ${res.status} ${JSON.stringify(res.body)}`);
    return res.body;
  }

  async signOut(): Promise<void> {
    const res = await this.post('/api/auth/sign-out');
    if (res.status !== 204) throw new Error(`sign-out → ${res.status}`);
    this._csrf = undefined;
  }

  async me(): Promise<ApiResponse<MeResponse>> {
    return this.get<MeResponse>('/api/auth/me');
  }

  private _keepCookies(headers: Headers): void {
    for (const line of headers.getSetCookie()) {
      const [pair = '', ...attrs] = line.split(';');
      const eq = pair.indexOf('=');
      if (eq < 1) continue;
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      const expired = attrs.some((a) => {
        const [k = '', v = ''] = a.split('=');
        const key = k.trim().toLowerCase();
        return (
          (key === 'expires' && Date.parse(v) <= Date.now()) ||
          (key === 'max-age' && Number(v) <= 0)
        );
      });
      if (expired || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }
}

/** A received mail as `GET /dev/mailbox.json` lists it. */
export interface MailboxMessage {
  id: number;
  to: string[];
  subject: string;
  text: string;
  links: string[];
}

/** Messages the fake SMTP server received for `to` (newest first), read over HTTP. */
export async function mailTo(baseUrl: string, to: string): Promise<MailboxMessage[]> {
  const res = await fetch(new URL('/dev/mailbox.json', baseUrl));
  if (res.status !== 200) throw new Error(`GET /dev/mailbox.json → ${res.status}`);
  const all = (await res.json()) as MailboxMessage[];
  return all.filter((m) => m.to.includes(to.toLowerCase()));
}

/** The last link in the newest mail to `to` whose path starts with `pathPrefix`. */
export async function linkInMail(baseUrl: string, to: string, pathPrefix: string): Promise<string> {
  for (const m of await mailTo(baseUrl, to)) {
    const link = m.links.find((l) => new URL(l).pathname.startsWith(pathPrefix));
    if (link) return link;
  }
  throw new Error(`no mail to ${to} with a ${pathPrefix} link`);
}
