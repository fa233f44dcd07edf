// A third baseline for `npm run bench`: the same balance computation behind a bare NestJS app on
// the Fastify adapter — one controller, a bearer-token check in a Map, solveBalance from shared/,
// JSON out. No guards, pipes, interceptors, metering or our hooks: the gap between this and plain
// Fastify is NestJS's own request pipeline; the rest of the gap to Lumenwright is ours.
import 'reflect-metadata';
import {
  Body,
  Controller,
  Headers,
  HttpCode,
  Module,
  Post,
  UnauthorizedException,
} from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { FastifyAdapter } from '@nestjs/platform-fastify';
import { solveBalance } from '@lumenwright/shared';
import { benchKeys } from './keys.mjs';

const port = Number(process.argv[2] ?? 0);
const keys = benchKeys();

class BalanceController {
  balance(authorization, body) {
    if (!keys.has((authorization ?? '').slice(7))) throw new UnauthorizedException();
    return solveBalance(body);
  }
}
const method = Object.getOwnPropertyDescriptor(BalanceController.prototype, 'balance');
Reflect.decorate([Post('balance'), HttpCode(200)], BalanceController.prototype, 'balance', method);
Headers('authorization')(BalanceController.prototype, 'balance', 0);
Body()(BalanceController.prototype, 'balance', 1);
Reflect.decorate([Controller('v1')], BalanceController);

class BenchModule {}
Reflect.decorate([Module({ controllers: [BalanceController] })], BenchModule);

const app = await NestFactory.create(BenchModule, new FastifyAdapter(), { logger: false });
await app.listen(port, '127.0.0.1');
const address = app.getHttpServer().address();
process.send?.({ port: address.port });
console.log(`nest baseline on 127.0.0.1:${address.port}`);
process.on('SIGTERM', () => app.close().then(() => process.exit(0)));
