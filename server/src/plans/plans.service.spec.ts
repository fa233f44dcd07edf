import type { DataSource } from 'typeorm';
import { PLAN_CATALOGUE } from './plan-catalogue.js';
import { PlansService } from './plans.service.js';

/** A data source that answers from the catalogue until `down` is set. */
function fakeDs() {
  const state = { down: false, planCode: 'studio' };
  const fail = () => Promise.reject(new Error('connect ECONNREFUSED 127.0.0.1:5432'));
  const ds = {
    query: () => (state.down ? fail() : Promise.resolve([{ plan_code: state.planCode }])),
    getRepository: () => ({
      find: () => (state.down ? fail() : Promise.resolve([...PLAN_CATALOGUE])),
    }),
  } as unknown as DataSource;
  return { ds, state };
}

describe('PlansService while the database is down', () => {
  it('answers 503 unavailable (never a 500) when it knows nothing yet', async () => {
    const { ds, state } = fakeDs();
    state.down = true;
    await expect(new PlansService(ds).forOrganization('org-1')).rejects.toMatchObject({
      code: 'unavailable',
      headers: { 'Retry-After': '2' },
    });
  });

  it('keeps serving the plan it last saw when a refresh fails', async () => {
    const { ds, state } = fakeDs();
    const plans = new PlansService(ds);
    expect((await plans.forOrganization('org-1')).code).toBe('studio');
    state.down = true;
    const realNow = Date.now;
    Date.now = () => realNow() + 60_000; // past the cache time
    try {
      expect((await plans.forOrganization('org-1')).code).toBe('studio');
    } finally {
      Date.now = realNow;
    }
  });
});
