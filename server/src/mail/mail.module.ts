import { Global, Module } from '@nestjs/common';
import { MailService } from './mail.service.js';

/** Global: any feature can queue a templated e-mail. */
@Global()
@Module({ providers: [MailService], exports: [MailService] })
export class MailModule {}
