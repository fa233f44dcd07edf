import 'reflect-metadata';
import { ConfigError, loadConfig } from './config/config.js';

async function main() {
  let config;
  try {
    config = loadConfig();
  } catch (e) {
    if (e instanceof ConfigError) {
      console.error(`Configuration error: ${e.message}`);
      process.exit(2);
    }
    throw e;
  }
  // Loaded after the configuration is read: a bad setting is reported at once, not after the
  // whole application (every module, TypeORM, the SDKs) has been imported.
  const { createApp } = await import('./app.factory.js');
  const app = await createApp(config, { bufferLogs: true });
  await app.listen({ port: config.port, host: config.host });
  console.log(`Lumenwright API listening on http://${config.host}:${config.port}`);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
