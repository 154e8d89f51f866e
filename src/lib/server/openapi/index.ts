export { buildOpenApiDocument, openApiPath, AUTH_WORDS } from './document';
export { operations, type Operation, type Auth, type Method } from './routes';
