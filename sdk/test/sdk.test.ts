// The SDK against a live server: sign up, make a key, call every endpoint, see typed errors,
// retries on 429 honouring Retry-After, and timeouts; test frames on the seeded demo studio.
import { randomUUID } from 'node:crypto';
import zlib from 'node:zlib';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { apiRoot, createApiClient, Lumenwright, LumenwrightError } from '../src/index.js';

const baseUrl = inject('baseUrl');

// The seeded demo studio (invented; server/src/auth/accounts.seeder.ts): its plan includes uploads.
const DEMO_OWNER = { email: 'ilse@kestrelmoor.test', password: 'kestrel-dusk-demo' };
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

/**
 * A width × height PNG of one sRGB grey (8-bit RGB, no filtering), built from the PNG
 * specification (ISO/IEC 15948): signature, IHDR, one zlib IDAT, IEND, each chunk with its CRC-32.
 */
function greyPng(width: number, height: number, level: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
    const out = Buffer.alloc(4 + body.length + 4);
    out.writeUInt32BE(data.length, 0);
    body.copy(out, 4);
    out.writeUInt32BE(zlib.crc32(body), 4 + body.length);
    return out;
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 2, 0, 0, 0], 8); // bit depth 8, colour type 2 (RGB), deflate, no filter, no interlace
  const row = Buffer.concat([Buffer.from([0]), Buffer.alloc(width * 3, level)]);
  const raw = Buffer.concat(Array.from({ length: height }, () => row));
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', zlib.deflateSync(raw)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** The sRGB decoding function (IEC 61966-2-1): 8-bit code value to linear light. */
const srgbToLinear = (code: number) => {
  const c = code / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
};

/** A key of the seeded demo studio, made by its owner. */
async function demoStudioKey(environment: 'live' | 'test'): Promise<string> {
  const signIn = await fetch(`${baseUrl}/v1/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(DEMO_OWNER),
  });
  expect(signIn.status).toBe(200);
  const cookie = (signIn.headers.getSetCookie?.() ?? []).map((c) => c.split(';')[0]).join('; ');
  const created = await createApiClient({ baseUrl }).POST('/v1/keys', {
    body: { name: `sdk frames ${randomUUID().slice(0, 8)}`, environment },
    headers: { cookie },
  });
  expect(created.response.status).toBe(201);
  return (created.data as { secret: string }).secret;
}

async function newKey(environment: 'live' | 'test'): Promise<string> {
  return (await newStudio(environment)).secret;
}

/** A new studio with a key, and the owner's session cookie for console-only writes. */
async function newStudio(
  environment: 'live' | 'test',
): Promise<{ secret: string; cookie: string }> {
  const api = createApiClient({ baseUrl });
  const email = `sdk-${randomUUID().slice(0, 8)}@sdk-tests.test`;
  const signUp = await fetch(`${baseUrl}/v1/auth/sign-up`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({
      email,
      password: 'amber-dusk-over-the-quay',
      name: 'Ada Fenwick',
      organizationName: 'Quayside Frames',
    }),
  });
  expect(signUp.status).toBe(201);
  const cookie = (signUp.headers.getSetCookie?.() ?? []).map((c) => c.split(';')[0]).join('; ');
  const created = await api.POST('/v1/keys', {
    body: { name: 'sdk test', environment },
    headers: { cookie },
  });
  expect(created.response.status).toBe(201);
  return { secret: (created.data as { secret: string }).secret, cookie };
}

describe('Lumenwright SDK', () => {
  let lw: Lumenwright;
  beforeAll(async () => {
    lw = new Lumenwright({ apiKey: await newKey('live'), baseUrl });
  });

  it('balances the flash to the camera (mired = 1e6 / K)', async () => {
    const r = await lw.balance({ cameraKelvin: 3800, flashKelvin: 5600 });
    // 1e6/3800 − 1e6/5600 = 84.59 mireds (definition of the mired).
    expect(r.requiredMiredShift).toBeCloseTo(84.59, 1);
    expect(r.gels.length).toBeGreaterThan(0);
  });

  it('answers flash, exposure, twilight, falloff, backlight and setup with typed results', async () => {
    // ISO 1230: GN 32 m at 4 m needs f/8 at full power, so f/4 needs a quarter.
    const f = await lw.flash({ guideNumber: 32, distance: 4, aperture: 4 });
    expect(f.powerFraction).toBeCloseTo(0.25, 3);
    const e = await lw.exposure({ ev100: 12, aperture: 8, iso: 100 });
    expect(e.shutterSeconds).toBeCloseTo(1 / 64, 5); // APEX: 2^12 = 8² / t
    const t = await lw.twilight({
      latitude: 51.507,
      longitude: -0.1,
      date: '2026-06-20',
      timeZone: 'Europe/London',
    });
    // London sunsets around 21:20 BST at the June solstice (from memory; the math library checks
    // exact times against an astronomy reference).
    expect(t.sunset).toMatch(/^2026-06-20T21:[12]\d:\d\d\+01:00$/);
    const fo = await lw.falloff({ subjectDistance: 2, backgroundDistance: 8 });
    expect(fo.subjectToBackgroundStops).toBeCloseTo(4, 3); // inverse square: 2·log2(8/2) = 4 stops
    const b = await lw.backlight({ lightHeight: 2, distanceBehind: 3 });
    expect(typeof b.headInBeam).toBe('boolean');
    const s = await lw.setup({
      latitude: 51.507,
      longitude: -0.1,
      date: '2026-06-20',
      timeZone: 'Europe/London',
      key: { guideNumber: 60, distance: 2.5 },
    });
    expect(Array.isArray(s.suggestedMinutes)).toBe(true);
  });

  it('plans the evening timeline: portrait slot clear of the events, typed warnings', async () => {
    // An invented terrace wedding. The phases come from the twilight code, whose times the math
    // library checks against suncalc and astronomy-engine; here the slot must follow the
    // schedule (interval arithmetic, common practice, no source): speeches end 21:40 and the
    // crew needs 15 minutes, so no set-up starts before 21:40 and no session before 21:55.
    const r = await lw.timeline({
      latitude: 51.507,
      longitude: -0.1,
      date: '2026-06-20',
      timeZone: 'Europe/London',
      events: [
        { label: 'Dinner', start: '19:00', end: '21:15' },
        { label: 'Speeches', start: '21:15', end: '21:40' },
      ],
      portraitMinutes: 20,
      setupMinutes: 15,
    });
    const best = r.slots[0]!;
    expect(Date.parse(best.setupFrom)).toBeGreaterThanOrEqual(
      Date.parse('2026-06-20T21:40:00+01:00'),
    );
    expect(Date.parse(best.session.start) - Date.parse(best.setupFrom)).toBe(15 * 60_000);
    expect(r.window.basis).toBe('blue-hour');
    const codes: string[] = r.warnings.map((w) => w.code);
    expect(codes.every((c) => !c.startsWith('polar'))).toBe(true);
    const err = await lw
      .timeline({
        latitude: 51.507,
        longitude: -0.1,
        date: '2026-06-20',
        timeZone: 'Europe/London',
        events: [{ label: 'Dinner', start: '21:00', end: '19:00' }],
        portraitMinutes: 20,
      })
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(LumenwrightError);
    expect((err as LumenwrightError).problem?.errors?.[0]?.field).toBe('events[0].end');
  });

  it('takes a base URL written with /v1 or a trailing slash as the same API', async () => {
    expect(apiRoot('https://api.example.test/v1/')).toBe('https://api.example.test');
    expect(apiRoot('https://api.example.test/v1')).toBe('https://api.example.test');
    expect(apiRoot('https://api.example.test/v1beta')).toBe('https://api.example.test/v1beta');
    const withV1 = new Lumenwright({ apiKey: await newKey('live'), baseUrl: `${baseUrl}/v1/` });
    const r = await withV1.balance({ cameraKelvin: 3200 });
    expect(r.resultingFlashKelvin).toBeGreaterThan(0);
  });

  it('throws a LumenwrightError carrying the problem for bad input', async () => {
    const err = await lw.balance({ cameraKelvin: -5, flashKelvin: 5600 }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(LumenwrightError);
    const le = err as LumenwrightError;
    expect(le.status).toBe(422);
    expect(le.code).toBe('invalid-input');
    expect(le.problem?.errors?.[0]?.field).toBe('cameraKelvin');
    expect(le.requestId).toBeTruthy();
  });

  it('throws 401 problems for a bad key', async () => {
    const bad = new Lumenwright({ apiKey: 'lw_live_nope', baseUrl });
    await expect(bad.exposure({ ev100: 10 })).rejects.toMatchObject({
      status: 401,
      kind: 'problem',
    });
  });

  it('retries a 429 after Retry-After, then succeeds (bounded)', async () => {
    const key = await newKey('live');
    const calls: number[] = [];
    const flaky = new Lumenwright({
      apiKey: 'unused',
      baseUrl,
      maxRetries: 2,
      fetch: async (req) => {
        calls.push(Date.now());
        if (calls.length === 1) {
          return new Response(
            JSON.stringify({
              type: 'https://lumenwright.test/problems/rate-limited',
              title: 'Too many requests',
              status: 429,
            }),
            {
              status: 429,
              headers: { 'content-type': 'application/problem+json', 'retry-after': '1' },
            },
          );
        }
        const headers = new Headers(req.headers);
        headers.set('authorization', `Bearer ${key}`);
        return globalThis.fetch(new Request(req, { headers }));
      },
    });
    const r = await flaky.exposure({ ev100: 10, aperture: 4 });
    expect(r.shutterSeconds).toBeGreaterThan(0);
    expect(calls).toHaveLength(2);
    // At least Retry-After; jitter adds up to half of it again.
    expect(calls[1]! - calls[0]!).toBeGreaterThanOrEqual(950);
    expect(calls[1]! - calls[0]!).toBeLessThan(1500 + 500);
  });

  it('gives up after maxRetries and never retries an exhausted quota', async () => {
    let n = 0;
    const always429 = (type: string) =>
      new Lumenwright({
        apiKey: 'x',
        baseUrl,
        maxRetries: 2,
        fetch: async () => {
          n++;
          return new Response(JSON.stringify({ type, title: 'Too many requests', status: 429 }), {
            status: 429,
            headers: { 'content-type': 'application/problem+json', 'retry-after': '0' },
          });
        },
      });
    await expect(
      always429('https://lumenwright.test/problems/rate-limited').exposure({ ev100: 1 }),
    ).rejects.toMatchObject({ status: 429 });
    expect(n).toBe(3);
    n = 0;
    await expect(
      always429('https://lumenwright.test/problems/quota-exceeded').exposure({ ev100: 1 }),
    ).rejects.toMatchObject({
      code: 'quota-exceeded',
    });
    expect(n).toBe(1);
  });

  it('times out a call that takes too long', async () => {
    const slow = new Lumenwright({
      apiKey: 'x',
      baseUrl,
      timeoutMs: 100,
      fetch: (req) =>
        new Promise((_resolve, reject) => {
          req.signal.addEventListener('abort', () => reject(req.signal.reason));
        }),
    });
    await expect(slow.exposure({ ev100: 1 })).rejects.toMatchObject({ kind: 'timeout', status: 0 });
  });

  it('reads the studio gear with the key and uses a kit id in a balance', async () => {
    const { secret, cookie } = await newStudio('live');
    const api = createApiClient({ baseUrl });
    const light = await api.POST('/v1/gear/lights', {
      body: { name: 'Garden strobe', guideNumber: 52, guideNumberUnit: 'm' },
      headers: { cookie },
    });
    expect(light.response.status).toBe(201);
    const kit = await api.POST('/v1/gear/gel-kits', {
      body: {
        name: 'Warmers',
        // CTO: 5500 K → 2900 K, a shift of about +159 mired (1e6/2900 − 1e6/5500), from memory.
        pieces: [{ name: 'Full CTO', miredShift: 159, greenShift: 0, lossStops: 0.7 }],
      },
      headers: { cookie },
    });
    expect(kit.response.status).toBe(201);
    const own = new Lumenwright({ apiKey: secret, baseUrl });
    const lights = await own.gear.lights();
    expect(lights.data.map((l) => l.name)).toEqual(['Garden strobe']);
    expect((await own.gear.light(lights.data[0]!.id)).guideNumberM).toBe(52);
    expect((await own.gear.modifiers()).data).toEqual([]);
    const kits = await own.gear.gelKits();
    const kitId = kits.data[0]!.id;
    expect((await own.gear.gelKit(kitId)).pieces.map((p) => p.name)).toEqual(['Full CTO']);
    // 1e6/3200 − 1e6/5500 = 130.7 mired wanted (definition of the mired); the kit's only gel gives 159.
    const r = await own.balance({ cameraKelvin: 3200, flashKelvin: 5500, gelKitId: kitId });
    expect(r.requiredMiredShift).toBeCloseTo(130.68, 1);
    expect(r.gels.map((g) => g.name)).toEqual(['Full CTO']);
    // Another studio's key reads none of it.
    await expect(lw.gear.gelKit(kitId)).rejects.toMatchObject({ status: 404 });
  });

  it('uploads a test frame from bytes and from a Blob, lists, reads, fetches its thumbnail and deletes it', async () => {
    const demo = new Lumenwright({ apiKey: await demoStudioKey('test'), baseUrl });
    const png = greyPng(64, 48, 128);
    const patch = { x: 8, y: 8, width: 32, height: 24 };
    const f = await demo.frames.upload({
      file: png,
      filename: 'dusk-card.png',
      patch,
      cameraKelvin: 5600,
    });
    expect(f.id).toMatch(UUID);
    expect(f).toMatchObject({
      fileName: 'dusk-card.png',
      contentType: 'image/png',
      byteSize: png.length,
      width: 64,
      height: 48,
    });
    expect(f.patch).toMatchObject({ ...patch, source: 'caller' });
    // A neutral sRGB grey has the sRGB white point, D65: x 0.3127, y 0.3290 (IEC 61966-2-1),
    // whose CCT is 6504 K (CIE 15:2004, table T.3); 8-bit rounding moves it a few kelvin at most.
    expect(f.colour.chromaticity.x).toBeCloseTo(0.3127, 3);
    expect(f.colour.chromaticity.y).toBeCloseTo(0.329, 3);
    expect(Math.abs(f.colour.cctKelvin! - 6504)).toBeLessThanOrEqual(15);
    expect(f.colour.cameraKelvinSource).toBe('caller');
    // Its luminance is the sRGB decoding of code value 128 (IEC 61966-2-1): about 0.2158.
    expect(f.patch.luminance).toBeCloseTo(srgbToLinear(128), 3);
    // An even, mid-grey, unclipped patch: nothing to warn about.
    expect(f.warnings).toEqual([]);

    const blob = await demo.frames.upload({
      file: new Blob([new Uint8Array(greyPng(32, 32, 200))], { type: 'image/png' }),
      filename: 'second.png',
    });
    expect(blob.fileName).toBe('second.png');
    expect(blob.patch.source).toBe('auto');
    // No cameraKelvin given: the note says which white balance was assumed, as a stable code.
    expect(blob.colour.cameraKelvinSource).toBe('assumed');
    expect(blob.colour.notes.map((n) => n.code)).toContain('camera-white-balance-assumed');

    const page = await demo.frames.list({ limit: 2 });
    expect(page.data.map((x) => x.id)).toEqual([blob.id, f.id]);
    expect((await demo.frames.get(f.id)).sha256).toBe(f.sha256);
    const thumb = await demo.frames.thumbnail(f.id);
    expect(thumb.type).toBe('image/jpeg');
    // Every JPEG starts with the SOI marker FF D8 (ITU-T T.81, annex B).
    expect([...new Uint8Array(await thumb.arrayBuffer()).slice(0, 2)]).toEqual([0xff, 0xd8]);

    await demo.frames.delete(f.id);
    await demo.frames.delete(blob.id);
    await expect(demo.frames.get(f.id)).rejects.toMatchObject({ status: 404 });
    await expect(demo.frames.delete(f.id)).rejects.toMatchObject({ status: 404 });
  });

  it('refuses a bad page size naming the parameter, and uploads on a plan without them', async () => {
    for (const limit of [0, 1000, 1.5]) {
      const err = (await lw.frames.list({ limit }).catch((e: unknown) => e)) as LumenwrightError;
      expect(err).toBeInstanceOf(LumenwrightError);
      expect(err.status).toBe(422);
      expect(err.problem?.errors).toEqual([
        { field: 'limit', reason: 'must be a whole number from 1 to 100' },
      ]);
    }
    // A new studio is on the free plan, which has no uploads: refused before the file is read.
    const err = (await lw.frames
      .upload({ file: greyPng(8, 8, 128), filename: 'a.png' })
      .catch((e: unknown) => e)) as LumenwrightError;
    expect(err.status).toBe(403);
    expect(err.code).toBe('plan-feature-missing');
  });

  it('says which key is calling', async () => {
    const me = await lw.whoami();
    expect(me).toMatchObject({ kind: 'api-key', keyMode: 'live', userId: null, role: null });
    expect(me.keyId).toMatch(UUID);
    expect(me.organizationId).toMatch(UUID);
    const test = await new Lumenwright({ apiKey: await newKey('test'), baseUrl }).whoami();
    expect(test.keyMode).toBe('test');
    expect(test.organizationId).not.toBe(me.organizationId);
  });

  it("reads this month's usage against the plan", async () => {
    const own = new Lumenwright({ apiKey: await newKey('live'), baseUrl });
    const before = await own.usage();
    expect(before.plan.code).toBe('free');
    expect(before.usage.liveCallsCounted).toBe(0);
    const free = (await own.plans()).data.find((p) => p.code === 'free')!;
    expect(before.plan.includedCallsPerMonth).toBe(free.includedCallsPerMonth);
    // The quota resets at the start of the next calendar month, UTC.
    const now = new Date();
    const next = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() + 1, 1));
    expect(before.resetsAt).toBe(next.toISOString());
    await own.balance({ cameraKelvin: 3800, flashKelvin: 5600 });
    await own.balance({ cameraKelvin: 4300, flashKelvin: 5600 });
    await own.balance({ cameraKelvin: -1 }).catch(() => undefined); // refused: not counted
    // Usage is written in small batches: wait for the calls to show (4 reads a second stays
    // under the free plan's 5 a second).
    let after = await own.usage();
    for (
      let i = 0;
      i < 40 && (after.usage.liveCallsCounted < 2 || after.usage.liveCalls < 3);
      i++
    ) {
      await new Promise((r) => setTimeout(r, 250));
      after = await own.usage();
    }
    expect(after.usage.liveCallsCounted).toBe(2);
    expect(after.usage.liveCalls).toBe(3);
  });

  it('retries a call whose answer was lost with the same Idempotency-Key: answered once, counted once', async () => {
    const secret = await newKey('live');
    const keysSent: (string | null)[] = [];
    const replayed: (string | null)[] = [];
    let dropped = 0;
    const lossy = new Lumenwright({
      apiKey: secret,
      baseUrl,
      fetch: async (req) => {
        const res = await globalThis.fetch(req);
        if (req.method !== 'POST') return res;
        keysSent.push(req.headers.get('idempotency-key'));
        replayed.push(res.headers.get('idempotency-replayed'));
        // The first answer reaches the server's side of the wire and is lost on the way back.
        if (dropped++ === 0) throw new TypeError('fetch failed: connection reset');
        return res;
      },
    });
    const r = await lossy.balance({ cameraKelvin: 3800, flashKelvin: 5600 });
    // 1e6/3800 − 1e6/5600 = 84.59 mireds (definition of the mired).
    expect(r.requiredMiredShift).toBeCloseTo(84.59, 1);
    expect(keysSent).toHaveLength(2);
    expect(keysSent[0]).toMatch(UUID);
    expect(keysSent[1]).toBe(keysSent[0]);
    expect(replayed).toEqual([null, 'true']);
    // A key of the caller's own is sent as given; separate calls get separate keys.
    await lossy.balance({ cameraKelvin: 4300, flashKelvin: 5600 }, { idempotencyKey: 'shoot-42' });
    await lossy.balance({ cameraKelvin: 4300, flashKelvin: 5600 });
    expect(keysSent.slice(2)).toHaveLength(2);
    expect(keysSent[2]).toBe('shoot-42');
    expect(keysSent[3]).not.toBe(keysSent[0]);
    // Three calls counted, though four requests reached the server.
    const own = new Lumenwright({ apiKey: secret, baseUrl });
    let usage = await own.usage();
    for (let i = 0; i < 40 && usage.usage.liveCallsCounted < 3; i++) {
      await new Promise((res) => setTimeout(res, 250));
      usage = await own.usage();
    }
    await new Promise((res) => setTimeout(res, 500));
    usage = await own.usage();
    expect(usage.usage.liveCallsCounted).toBe(3);
  });

  it('lists the plans', async () => {
    const plans = await lw.plans();
    expect(plans.data.map((p) => p.code)).toEqual(['free', 'studio', 'platform']);
    // Test keys get the plan's rate capped at 10 a second, burst 20 (the service's published
    // policy; the server's unit test ties these to the rate-limit guard).
    for (const p of plans.data) {
      expect(p.testKeyRatePerSecond).toBe(Math.min(p.ratePerSecond, 10));
      expect(p.testKeyBurst).toBe(Math.min(p.burst, 20));
    }
  });
});
