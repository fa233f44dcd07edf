// passport-http-bearer, wired through @nestjs/passport; the Authenticator calls it for bearer routes.
import { Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { Strategy } from 'passport-http-bearer';
import type { Principal } from '../common/guards/access.guard.js';
import { KeyVerifier } from './key-verifier.service.js';

export const BEARER_STRATEGY = 'lw-bearer';

/** The actions a passport strategy reports through (passport-strategy's contract). */
interface StrategyRun {
  success(user: Principal): void;
  fail(): void;
  pass(): void;
  redirect(): void;
  error(err: unknown): void;
  authenticate(req: unknown, options?: object): void;
}

@Injectable()
export class BearerStrategy extends PassportStrategy(Strategy, BEARER_STRATEGY) {
  constructor(private readonly verifier: KeyVerifier) {
    super();
  }

  async validate(token: string): Promise<Principal | null> {
    return this.verifier.verify(token);
  }

  /**
   * Runs this strategy on one request, the way passport.authenticate does for each strategy
   * (a per-request object over the strategy with success/fail/error bound to the caller), without
   * the middleware's extras a stateless bearer call never uses: login/logout helpers written onto
   * the request, sessions, flash messages and redirects.
   */
  check(req: unknown): Promise<Principal | null> {
    return new Promise((resolve, reject) => {
      const run = Object.create(this) as StrategyRun;
      run.success = resolve;
      run.fail = () => resolve(null);
      run.pass = () => resolve(null);
      run.redirect = () => resolve(null);
      run.error = reject;
      run.authenticate(req);
    });
  }
}
