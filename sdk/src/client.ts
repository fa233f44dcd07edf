// A thin, typed client over openapi-fetch: one method per compute endpoint, gear reads, test frames,
// who-am-I and this month's usage; problem+json turned
// into LumenwrightError, bounded retries on 429 (rate limited) and 503 honouring Retry-After,
// and a timeout per attempt. Metered calls carry an Idempotency-Key, the same on every attempt,
// so they are retried after timeouts and dropped connections too without being counted twice.
import createClient, { type Client } from 'openapi-fetch';
import type { components, paths } from './generated/schema.js';
import { LumenwrightError, type Problem } from './errors.js';

type Schemas = components['schemas'];
export type TwilightRequest = Schemas['TwilightRequestDto'];
export type TwilightResponse = Schemas['TwilightResponseDto'];
export type ExposureRequest = Schemas['ExposureRequestDto'];
export type ExposureResponse = Schemas['ExposureResponseDto'];
export type FlashRequest = Schemas['FlashRequestDto'];
export type FlashResponse = Schemas['FlashResponseDto'];
export type FalloffRequest = Schemas['FalloffRequestDto'];
export type FalloffResponse = Schemas['FalloffResponseDto'];
export type BacklightRequest = Schemas['BacklightRequestDto'];
export type BacklightResponse = Schemas['BacklightResponseDto'];
export type BalanceRequest = Schemas['BalanceRequestDto'];
export type BalanceResponse = Schemas['BalanceResponseDto'];
export type SetupRequest = Schemas['SetupRequestDto'];
export type SetupResponse = Schemas['SetupResponseDto'];
export type TimelineRequest = Schemas['TimelineRequestDto'];
export type TimelineResponse = Schemas['TimelineResponseDto'];
/** Where the session goes in its free stretch: `earliest` (default), `latest`, `mid-blue-hour`. */
export type TimelinePlacement = NonNullable<TimelineRequest['placement']>;
export type PlanList = Schemas['PlanListResponseDto'];
export type Light = Schemas['LightResponseDto'];
export type LightList = Schemas['LightListResponseDto'];
export type Modifier = Schemas['ModifierResponseDto'];
export type ModifierList = Schemas['ModifierListResponseDto'];
export type GelKit = Schemas['GelKitResponseDto'];
export type GelKitList = Schemas['GelKitListResponseDto'];
export type Frame = Schemas['FrameResponseDto'];
export type FrameList = Schemas['FrameListResponseDto'];
export type WhoAmI = Schemas['WhoAmIResponseDto'];
export type CurrentPlan = Schemas['CurrentPlanResponseDto'];
/** The multipart body of POST /v1/frames as the spec states it (`file` is a Blob). */
export type FrameUploadBody =
  paths['/v1/frames']['post']['requestBody']['content']['multipart/form-data'];
export type FrameListQuery = NonNullable<paths['/v1/frames']['get']['parameters']['query']>;

/** A test frame to upload: the bytes, a file name, and optionally the neutral patch. */
export interface FrameUpload {
  /** The JPEG or PNG: a Blob or File, or bytes (a Uint8Array; a Node Buffer is one). */
  file: Blob | Uint8Array;
  /** The file name the frame keeps (`fileName`), e.g. "terrace-0142.jpg". */
  filename: string;
  /** The neutral patch in upright pixel coordinates; without it the server looks for one. */
  patch?: { x: number; y: number; width: number; height: number };
  /** The white balance the frame was shot at, kelvin (1500-20000). */
  cameraKelvin?: number;
}

/** The upload as the spec types it: the bytes as a Blob, the patch as four whole numbers. */
export function frameUploadBody(upload: FrameUpload): FrameUploadBody {
  return {
    // Bytes are copied into a Blob of their own (a Buffer may be a view into a shared pool).
    file: upload.file instanceof Blob ? upload.file : new Blob([new Uint8Array(upload.file)]),
    ...(upload.patch
      ? {
          patchX: upload.patch.x,
          patchY: upload.patch.y,
          patchWidth: upload.patch.width,
          patchHeight: upload.patch.height,
        }
      : {}),
    ...(upload.cameraKelvin === undefined ? {} : { cameraKelvin: upload.cameraKelvin }),
  };
}

/** The multipart form: the fields first, the file last (the server reads parts as they stream). */
export function frameUploadForm(body: FrameUploadBody, filename: string): FormData {
  const form = new FormData();
  for (const [name, value] of Object.entries(body)) {
    if (name !== 'file' && value !== undefined) form.append(name, String(value));
  }
  form.append('file', body.file, filename);
  return form;
}

export type FetchLike = (request: Request) => Promise<Response>;

/** Per-call options of the metered calls (computations and frame uploads). */
export interface CallOptions {
  /**
   * The call's Idempotency-Key. Every attempt of one call sends the same key, so a retry after a
   * timeout or a dropped connection is answered from the first attempt and not counted or billed
   * twice. Default: a new random UUID per call. Pass your own to retry a call across restarts.
   */
  idempotencyKey?: string;
}

export interface LumenwrightOptions {
  /** A secret API key: lw_live_… or lw_test_… */
  apiKey: string;
  /** Where the API lives, e.g. http://127.0.0.1:3000 (no /v1). */
  baseUrl: string;
  /** Your own fetch (tests, proxies); defaults to the global fetch at call time. */
  fetch?: FetchLike;
  /** Per-attempt timeout, ms; default 10 000. */
  timeoutMs?: number;
  /** Retries on 429 (rate limited) and 503; default 2. Quota exhaustion is never retried. */
  maxRetries?: number;
  /** Longest Retry-After we are willing to wait, seconds; default 30. */
  maxRetryAfterSeconds?: number;
}

type ComputePath =
  | '/v1/twilight'
  | '/v1/exposure'
  | '/v1/flash'
  | '/v1/falloff'
  | '/v1/backlight'
  | '/v1/balance'
  | '/v1/setup'
  | '/v1/timeline';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function retryAfter(res: Response): number | null {
  const v = res.headers.get('retry-after');
  if (!v) return null;
  const n = Number(v);
  if (Number.isFinite(n)) return Math.max(0, n);
  const at = Date.parse(v);
  return Number.isNaN(at) ? null : Math.max(0, (at - Date.now()) / 1000);
}

/**
 * The API's root from a base URL: the spec's paths start with /v1, so a base URL given with /v1
 * (a common way to write it) would double it and get 404s. Trailing slashes go too.
 */
export function apiRoot(baseUrl: string): string {
  return baseUrl.replace(/\/+$/, '').replace(/\/v1$/, '');
}

export class Lumenwright {
  private readonly client: Client<paths>;
  private readonly timeoutMs: number;
  private readonly maxRetries: number;
  private readonly maxRetryAfter: number;

  constructor(opts: LumenwrightOptions) {
    if (!opts.apiKey) throw new TypeError('Lumenwright: apiKey is required');
    if (!/^https?:\/\//.test(opts.baseUrl))
      throw new TypeError('Lumenwright: baseUrl must be an absolute http(s) URL');
    const userFetch = opts.fetch;
    this.client = createClient<paths>({
      baseUrl: apiRoot(opts.baseUrl),
      // Read the global fetch per call so it can be swapped (tests) after the client is made.
      fetch: (r: Request) => (userFetch ? userFetch(r) : globalThis.fetch(r)),
      headers: { Authorization: `Bearer ${opts.apiKey}` },
    });
    this.timeoutMs = opts.timeoutMs ?? 10_000;
    this.maxRetries = Math.max(0, Math.min(opts.maxRetries ?? 2, 10));
    this.maxRetryAfter = opts.maxRetryAfterSeconds ?? 30;
  }

  twilight = (body: TwilightRequest, o?: CallOptions) =>
    this.compute<TwilightResponse>('/v1/twilight', body, o);
  exposure = (body: ExposureRequest, o?: CallOptions) =>
    this.compute<ExposureResponse>('/v1/exposure', body, o);
  flash = (body: FlashRequest, o?: CallOptions) =>
    this.compute<FlashResponse>('/v1/flash', body, o);
  falloff = (body: FalloffRequest, o?: CallOptions) =>
    this.compute<FalloffResponse>('/v1/falloff', body, o);
  backlight = (body: BacklightRequest, o?: CallOptions) =>
    this.compute<BacklightResponse>('/v1/backlight', body, o);
  balance = (body: BalanceRequest, o?: CallOptions) =>
    this.compute<BalanceResponse>('/v1/balance', body, o);
  setup = (body: SetupRequest, o?: CallOptions) =>
    this.compute<SetupResponse>('/v1/setup', body, o);
  /**
   * The evening as a timeline: phases, booked events and portrait slots clear of them, the
   * session placed as `placement` asks, with safety cautions for the `conditions`.
   */
  timeline = (body: TimelineRequest, o?: CallOptions) =>
    this.compute<TimelineResponse>('/v1/timeline', body, o);

  /**
   * The studio's gear list, read with the key (writing it is a console action). Compute calls
   * take these ids: `key.lightId`, `key.modifierId`, `rim.lightId`, `gelKitId`…
   */
  readonly gear = {
    lights: (): Promise<LightList> =>
      this.read((signal) => this.client.GET('/v1/gear/lights', { signal })),
    light: (id: string): Promise<Light> =>
      this.read((signal) =>
        this.client.GET('/v1/gear/lights/{id}', { params: { path: { id } }, signal }),
      ),
    modifiers: (): Promise<ModifierList> =>
      this.read((signal) => this.client.GET('/v1/gear/modifiers', { signal })),
    modifier: (id: string): Promise<Modifier> =>
      this.read((signal) =>
        this.client.GET('/v1/gear/modifiers/{id}', { params: { path: { id } }, signal }),
      ),
    gelKits: (): Promise<GelKitList> =>
      this.read((signal) => this.client.GET('/v1/gear/gel-kits', { signal })),
    gelKit: (id: string): Promise<GelKit> =>
      this.read((signal) =>
        this.client.GET('/v1/gear/gel-kits/{id}', { params: { path: { id } }, signal }),
      ),
  };

  /**
   * Test frames: upload one (a metered call, like a computation; the plan must include uploads),
   * list, read, fetch the thumbnail and delete. Reads and deletes use no quota but share the
   * key's rate limit.
   */
  readonly frames = {
    upload: (upload: FrameUpload, o?: CallOptions): Promise<Frame> => {
      const headers = { 'Idempotency-Key': o?.idempotencyKey ?? newIdempotencyKey() };
      return this.attempt(
        (signal) =>
          this.client.POST('/v1/frames', {
            // Typed as the spec says; sent as multipart/form-data (fetch sets the boundary). The
            // form is rebuilt on each attempt, so a retried upload sends the whole file again;
            // its Idempotency-Key makes the server store it once.
            body: frameUploadBody(upload),
            bodySerializer: (body) => frameUploadForm(body, upload.filename),
            headers,
            signal,
          }),
        true,
      ) as Promise<Frame>;
    },
    list: (query: FrameListQuery = {}): Promise<FrameList> =>
      this.read((signal) => this.client.GET('/v1/frames', { params: { query }, signal })),
    get: (id: string): Promise<Frame> =>
      this.read((signal) =>
        this.client.GET('/v1/frames/{id}', { params: { path: { id } }, signal }),
      ),
    /** The JPEG thumbnail (at most 320 px on its long side). */
    thumbnail: (id: string): Promise<Blob> =>
      this.read((signal) =>
        this.client.GET('/v1/frames/{id}/thumbnail', {
          params: { path: { id } },
          parseAs: 'blob',
          signal,
        }),
      ),
    delete: async (id: string): Promise<void> => {
      await this.attempt((signal) =>
        this.client.DELETE('/v1/frames/{id}', { params: { path: { id } }, signal }),
      );
    },
  };

  /** Which key is calling and for which organisation (no side effects; not metered). */
  whoami = (): Promise<WhoAmI> => this.read((signal) => this.client.GET('/v1/whoami', { signal }));

  /**
   * This month's usage against the plan: `usage.liveCallsCounted` against
   * `plan.includedCallsPerMonth` (test keys: `testCallsCounted` against `testCallsPerMonth`),
   * and when the quota resets. Uses no quota; the key's rate limit applies.
   */
  usage = (): Promise<CurrentPlan> =>
    this.read((signal) => this.client.GET('/v1/plans/current', { signal }));

  /** The plans (public). */
  plans = (): Promise<PlanList> =>
    this.attempt(async (signal) => this.client.GET('/v1/plans', { signal })) as Promise<PlanList>;

  /** A read: safe to repeat, so retried after a timeout or a network error too. */
  private read<T>(
    call: (signal: AbortSignal) => Promise<{ data?: T; error?: unknown; response: Response }>,
  ): Promise<T> {
    return this.attempt(call, true) as Promise<T>;
  }

  private compute<T>(path: ComputePath, body: unknown, o?: CallOptions): Promise<T> {
    const headers = { 'Idempotency-Key': o?.idempotencyKey ?? newIdempotencyKey() };
    return this.attempt(
      (signal) =>
        // The path/body pairing is enforced by the public methods' signatures.
        this.client.POST(path as '/v1/balance', { body: body as BalanceRequest, headers, signal }),
      true,
    ) as Promise<T>;
  }

  /**
   * Runs a call, retrying 429 (not an exhausted quota), 503 and 409 "still in progress". A call
   * that is safe to repeat (`idempotent`: a read, or a POST with its Idempotency-Key) is also
   * retried after a timeout or a network error.
   */
  private async attempt(
    call: (signal: AbortSignal) => Promise<{ data?: unknown; error?: unknown; response: Response }>,
    idempotent = false,
  ): Promise<unknown> {
    for (let attempt = 0; ; attempt++) {
      let result: { data?: unknown; error?: unknown; response: Response };
      try {
        result = await call(AbortSignal.timeout(this.timeoutMs));
      } catch (err) {
        const timeout = (err as { name?: string })?.name === 'TimeoutError';
        if (idempotent && attempt < this.maxRetries) {
          await sleep(2 ** attempt * 250 + Math.random() * 100);
          continue;
        }
        throw new LumenwrightError({
          kind: timeout ? 'timeout' : 'network',
          status: 0,
          message: timeout
            ? `No answer within ${this.timeoutMs} ms`
            : `Network error: ${String(err)}`,
          cause: err,
        });
      }
      const { response } = result;
      if (response.ok) return result.data;
      const problem = (
        result.error && typeof result.error === 'object' ? result.error : null
      ) as Problem | null;
      const wait = retryAfter(response);
      const retryable =
        (response.status === 503 ||
          (response.status === 409 && !!problem?.type?.endsWith('/idempotency-key-in-use')) ||
          (response.status === 429 && !problem?.type?.endsWith('/quota-exceeded'))) &&
        attempt < this.maxRetries &&
        (wait ?? 1) <= this.maxRetryAfter;
      if (retryable) {
        // Retry-After when given, plus up to half of it again (at most 1 s) so that callers
        // refused in the same second do not all come back in the same second; otherwise a short
        // exponential backoff with jitter.
        await sleep(
          wait !== null
            ? wait * 1000 + Math.random() * Math.min(1000, wait * 500)
            : 2 ** attempt * 250 + Math.random() * 100,
        );
        continue;
      }
      throw new LumenwrightError({
        kind: 'problem',
        status: response.status,
        message: problem?.detail ?? problem?.title ?? `HTTP ${response.status}`,
        problem,
        requestId: response.headers.get('x-request-id'),
        retryAfterSeconds: wait,
      });
    }
  }
}

/** A fresh Idempotency-Key: a random UUID (Web Crypto, in Node 20 and every current browser). */
function newIdempotencyKey(): string {
  return globalThis.crypto.randomUUID();
}

/**
 * The raw typed client for the console (cookie session): every path in the API, with
 * `credentials: 'include'`. Results are openapi-fetch's `{ data, error, response }`.
 */
export function createApiClient(opts: {
  baseUrl: string;
  fetch?: FetchLike;
  headers?: Record<string, string>;
}) {
  const userFetch = opts.fetch;
  return createClient<paths>({
    baseUrl: apiRoot(opts.baseUrl),
    fetch: (r: Request) => (userFetch ? userFetch(r) : globalThis.fetch(r)),
    headers: opts.headers,
    credentials: 'include',
  });
}
