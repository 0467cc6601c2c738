import { Agent, request } from 'node:http';

export interface ApiResponse {
  readonly status: number;
  readonly body: Buffer;
  json<T>(): T;
}

/**
 * A signed-in HTTP client for the benchmark: one keep-alive connection (as a browser tab would hold),
 * the session cookie kept, and the CSRF token sent on every request that changes state.
 */
export class ApiClient {
  private readonly agent = new Agent({ keepAlive: true, maxSockets: 1 });
  private cookies = new Map<string, string>();
  private csrfToken = '';

  constructor(readonly baseUrl: string) {}

  /** The session cookie, for a browser context that should be signed in as this client. */
  cookie(name: string): string | undefined {
    return this.cookies.get(name);
  }

  async signIn(email: string, password: string): Promise<void> {
    this.csrfToken = (await this.ok('GET', '/api/auth/csrf')).json<{ csrfToken: string }>().csrfToken;
    await this.ok('POST', '/api/auth/sign-in', { email, password });
  }

  /** Sends a request and fails with the server's answer unless the status is 2xx. */
  async ok(method: string, path: string, body?: unknown): Promise<ApiResponse> {
    const response = await this.send(method, path, body);
    if (response.status >= 300) {
      throw new Error(`${method} ${path} answered ${response.status}: ${response.body.toString('utf8').slice(0, 500)}`);
    }
    return response;
  }

  /** A multipart upload of one file in the field `file`, as the web app's drop zone sends it. */
  upload(path: string, filename: string, content: Buffer): Promise<ApiResponse> {
    const boundary = `----provenote-bench-${Date.now()}`;
    const head = Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${filename}"\r\n` +
        'Content-Type: text/csv\r\n\r\n',
    );
    const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
    return this.raw('POST', path, Buffer.concat([head, content, tail]), `multipart/form-data; boundary=${boundary}`);
  }

  send(method: string, path: string, body?: unknown): Promise<ApiResponse> {
    const payload = body === undefined ? undefined : Buffer.from(JSON.stringify(body));
    return this.raw(method, path, payload, payload ? 'application/json' : undefined);
  }

  close(): void {
    this.agent.destroy();
  }

  private raw(method: string, path: string, payload?: Buffer, contentType?: string): Promise<ApiResponse> {
    const headers: Record<string, string> = { accept: 'application/json' };
    if (contentType) headers['content-type'] = contentType;
    if (payload) headers['content-length'] = String(payload.byteLength);
    if (this.csrfToken) headers['x-csrf-token'] = this.csrfToken;
    if (this.cookies.size > 0) headers.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    return new Promise((resolve, reject) => {
      const req = request(new URL(path, this.baseUrl), { method, headers, agent: this.agent }, (res) => {
        for (const line of res.headers['set-cookie'] ?? []) {
          const [pair] = line.split(';');
          const at = pair.indexOf('=');
          this.cookies.set(pair.slice(0, at).trim(), pair.slice(at + 1).trim());
        }
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('error', reject);
        res.on('end', () => {
          const buffer = Buffer.concat(chunks);
          resolve({
            status: res.statusCode ?? 0,
            body: buffer,
            json: <T>() => JSON.parse(buffer.toString('utf8')) as T,
          });
        });
      });
      req.on('error', reject);
      req.end(payload);
    });
  }
}
