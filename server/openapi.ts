// The OpenAPI document of /api/openapi.json, assembled from the description beside each routes
// module (server/modules/<resource>/openapi.ts). A new routes module adds its openapi.ts here;
// tests/api/openapi.test.ts walks the Express router and fails on a route that is not described.
import './modules/health/openapi';
import './modules/auth/openapi';
import './modules/sites/openapi';
import './modules/packages/openapi';
import './modules/check-runs/openapi';
import './modules/calculations/openapi';
import './modules/reviews/openapi';
import './modules/returns/openapi';
import './modules/verify/openapi';
import './modules/admin/openapi';
import './modules/profile/openapi';
import './modules/library/openapi';
import './modules/live/openapi';

export { openApiDocument } from './lib/openapi';
