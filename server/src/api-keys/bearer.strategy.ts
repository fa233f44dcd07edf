// passport-http-bearer, wired through @nestjs/passport; the Authenticator calls it for bearer routes.
import { Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { Strategy } from 'passport-http-bearer';
import type { Principal } from '../common/guards/access.guard.js';
import { KeyVerifier } from './key-verifier.service.js';

export const BEARER_STRATEGY = 'lw-bearer';

@Injectable()
export class BearerStrategy extends PassportStrategy(Strategy, BEARER_STRATEGY) {
  constructor(private readonly verifier: KeyVerifier) {
    super();
  }

  async validate(token: string): Promise<Principal | null> {
    return this.verifier.verify(token);
  }
}
