import { MemoryRateLimitStorage } from './rate-limit.storage.js';

// Token bucket as defined for traffic policing (RFC 2697 §3: a bucket of size CBS filled at CIR
// tokens per second; a packet conforms when a token is available).
describe('in-memory token bucket', () => {
  let now = 0;
  const store = new MemoryRateLimitStorage(() => now);
  afterAll(() => store.close());
  const rate = 5;
  const burst = 10;
  const ttl = (1000 * burst) / rate; // the guard's mapping: refill `burst` tokens per ttl

  it('lets a full burst through at once, then refuses', () => {
    now = 1_000_000;
    const results = Array.from({ length: 12 }, () => store.take('k:a', ttl, burst));
    expect(results.filter((r) => !r.isBlocked)).toHaveLength(10);
    expect(results[10]!.isBlocked).toBe(true);
    expect(results[10]!.timeToBlockExpire).toBe(1); // one token takes 1/5 s, rounded up to 1 s
  });

  it('refills at the rate: over 10 s of steady demand it admits burst + rate × 10 calls', () => {
    now = 5_000_000;
    let admitted = 0;
    for (let ms = 0; ms <= 10_000; ms += 10) {
      now = 5_000_000 + ms;
      if (!store.take('k:b', ttl, burst).isBlocked) admitted++;
    }
    expect(admitted).toBe(burst + rate * 10);
  });

  it('keeps keys apart', () => {
    now = 9_000_000;
    for (let i = 0; i < 10; i++) store.take('k:c', ttl, burst);
    expect(store.take('k:c', ttl, burst).isBlocked).toBe(true);
    expect(store.take('k:d', ttl, burst).isBlocked).toBe(false);
  });
});
