import { Global, Module } from '@nestjs/common';
import { AppConfig } from './app-config.js';
import { validateEnv } from './env.js';

/**
 * Reads and validates the environment when the module starts (not when it is imported), so a
 * bad setting stops the start with a clear message and tests can set the environment first.
 */
@Global()
@Module({
  providers: [{ provide: AppConfig, useFactory: () => new AppConfig(validateEnv(process.env)) }],
  exports: [AppConfig],
})
export class ConfigModule {}
