import 'reflect-metadata';
import { RequestMethod } from '@nestjs/common';
import { METHOD_METADATA, PATH_METADATA } from '@nestjs/common/constants.js';
import { Test } from '@nestjs/testing';
import { DiscoveryModule, DiscoveryService, MetadataScanner, Reflector } from '@nestjs/core';
import { AppModule } from '../src/app.module.js';
import { IS_PUBLIC } from '../src/common/decorators/public.decorator.js';
import { ROLES_KEY } from '../src/common/decorators/roles.decorator.js';
import { SIGNED_IN } from '../src/common/decorators/signed-in.decorator.js';

/**
 * Every route must say who may call it: @Public(), @SignedIn() or @Roles(...). A route added
 * without one of them fails here, so a forgotten declaration cannot ship.
 */
describe('route audit', () => {
  it('every route declares its access exactly once', async () => {
    const moduleRef = await Test.createTestingModule({
      imports: [AppModule, DiscoveryModule],
    }).compile();
    const discovery = moduleRef.get(DiscoveryService);
    const scanner = moduleRef.get(MetadataScanner);
    const reflector = moduleRef.get(Reflector);

    const routes: { route: string; declared: string[] }[] = [];
    for (const wrapper of discovery.getControllers()) {
      const instance = wrapper.instance as object;
      const proto = Object.getPrototypeOf(instance) as object;
      const base = String(Reflect.getMetadata(PATH_METADATA, wrapper.metatype as object) ?? '');
      for (const name of scanner.getAllMethodNames(proto)) {
        const handler = (proto as Record<string, unknown>)[name] as () => unknown;
        const path = Reflect.getMetadata(PATH_METADATA, handler) as string | undefined;
        if (path === undefined) continue;
        const method = RequestMethod[Reflect.getMetadata(METHOD_METADATA, handler) as number];
        const targets = [handler, wrapper.metatype as () => unknown];
        const declared = [
          reflector.getAllAndOverride(IS_PUBLIC, targets) ? 'public' : null,
          reflector.getAllAndOverride(SIGNED_IN, targets) ? 'signed-in' : null,
          (reflector.getAllAndOverride<string[] | undefined>(ROLES_KEY, targets)?.length ?? 0) > 0
            ? 'roles'
            : null,
        ].filter((d): d is string => d !== null);
        routes.push({
          route: `${method} /api/${base}/${path}`.replace(/\/+/g, '/').replace(/\/$/, ''),
          declared,
        });
      }
    }
    expect(routes.length).toBeGreaterThan(3);
    const undeclared = routes
      .filter((r) => r.declared.length !== 1)
      .map((r) => `${r.route} [${r.declared.join(', ') || 'none'}]`);
    expect(undeclared).toEqual([]);
    await moduleRef.close();
  });
});
