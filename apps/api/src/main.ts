import 'reflect-metadata';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { AppModule } from './app.module.js';
import { AppConfig } from './config/app-config.js';
import { configureApp } from './configure-app.js';

// Errors and warnings only: the start script prints what a person needs to know.
const app = await NestFactory.create<NestExpressApplication>(AppModule, {
  logger: ['error', 'warn'],
});
const extras = configureApp(app);
const config = app.get(AppConfig);
await app.listen(config.get('PORT'), config.get('HOST'));
console.log(`Skyhours API listening on http://${config.get('HOST')}:${config.get('PORT')}`);

let closing = false;
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    if (closing) return;
    closing = true;
    void app
      .close()
      .then(() => extras.close())
      .finally(() => process.exit(0));
  });
}
