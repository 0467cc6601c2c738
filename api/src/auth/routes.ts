import { RequestMethod } from '@nestjs/common';
import { METHOD_METADATA, PATH_METADATA } from '@nestjs/common/constants';
import { MetadataScanner, ModulesContainer, Reflector } from '@nestjs/core';
import type { INestApplication } from '@nestjs/common';
import { accessRule, type AccessRule } from './access.guard';

export interface DeclaredRoute {
  method: string;
  /** Full path with the global prefix, in Express syntax: `/api/labs/:labId/members`. */
  path: string;
  handler: string;
  rule: AccessRule;
}

const asList = (value: unknown): string[] => (Array.isArray(value) ? value : [value ?? '']).map(String);
const join = (...parts: string[]) =>
  '/' +
  parts
    .flatMap((part) => part.split('/'))
    .filter(Boolean)
    .join('/');

/** Every route of the application with the access rule it declares, read from Nest's own metadata. */
export function declaredRoutes(app: INestApplication, prefix: string): DeclaredRoute[] {
  const reflector = app.get(Reflector);
  const scanner = new MetadataScanner();
  const routes: DeclaredRoute[] = [];
  for (const module of app.get(ModulesContainer).values()) {
    for (const wrapper of module.controllers.values()) {
      const type = wrapper.metatype as (new (...args: unknown[]) => object) | null;
      if (!type) continue;
      const prototype = type.prototype as Record<string, unknown>;
      for (const name of scanner.getAllMethodNames(prototype)) {
        const handler = prototype[name] as (...args: unknown[]) => unknown;
        const methodPaths = Reflect.getMetadata(PATH_METADATA, handler) as unknown;
        if (methodPaths === undefined) continue;
        const method = RequestMethod[Reflect.getMetadata(METHOD_METADATA, handler) as RequestMethod];
        for (const controllerPath of asList(Reflect.getMetadata(PATH_METADATA, type))) {
          for (const methodPath of asList(methodPaths)) {
            routes.push({
              method,
              path: join(prefix, controllerPath, methodPath),
              handler: `${type.name}.${name}`,
              rule: accessRule(reflector, [handler, type]),
            });
          }
        }
      }
    }
  }
  return routes;
}
