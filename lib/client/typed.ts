import type { paths } from './api-types';

/**
 * Answer and body types of the HTTP API, from the types openapi-typescript generates out of /api/openapi.json
 * (lib/client/api-types.ts): the screens use these instead of re-typing what the server answers.
 */
type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
type JsonOf<R> = R extends { content: { 'application/json': infer B } } ? B : never;

export type ApiAnswer<P extends keyof paths, M extends Method> = paths[P][M] extends { responses: { 200: infer R } } ? JsonOf<R> : never;
export type ApiBody<P extends keyof paths, M extends Method> = paths[P][M] extends { requestBody?: infer B } ? JsonOf<NonNullable<B>> : never;
