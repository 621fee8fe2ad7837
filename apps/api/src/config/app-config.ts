import { Injectable } from '@nestjs/common';
import type { Env } from './env.js';

/** Typed access to the validated settings (see env.ts). */
@Injectable()
export class AppConfig {
  constructor(private readonly env: Env) {}

  get<K extends keyof Env>(key: K): Env[K] {
    return this.env[key];
  }

  get publicUrl(): string {
    return (this.env.PUBLIC_URL ?? `http://${this.env.HOST}:${this.env.PORT}`).replace(/\/$/, '');
  }

  get isProduction(): boolean {
    return this.env.NODE_ENV === 'production';
  }
}
