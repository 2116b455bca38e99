import { ogcCollectionIds, ogcDefaultLimit, ogcMaxLimit } from '../../shared/contracts/ogc';

/**
 * The API definition (OpenAPI 3.0) the landing page links as `service-desc`. It declares every
 * path and query parameter, so a parameter not listed here is refused with a 400.
 */
export function ogcOpenApi(publicUrl: string, caution: string) {
  const problem = { description: 'A problem with the request or a missing resource', content: { 'application/json': { schema: { type: 'object' } } } };
  const collectionId = { name: 'collectionId', in: 'path', required: true, schema: { type: 'string', enum: [...ogcCollectionIds] } };
  const f = { name: 'f', in: 'query', required: false, schema: { type: 'string', enum: ['json'] }, description: 'Encoding; only JSON is offered' };
  const jsonOk = (description: string) => ({ description, content: { 'application/json': { schema: { type: 'object' } } } });
  const geoOk = (description: string) => ({ description, content: { 'application/geo+json': { schema: { type: 'object' } } } });
  return {
    openapi: '3.0.3',
    info: { title: 'Stormdraft OGC API – Features', version: '1.0.0', description: `Severe-thunderstorm outlooks as features. ${caution}` },
    servers: [{ url: `${publicUrl}/api/ogc` }],
    paths: {
      '/': { get: { operationId: 'getLandingPage', parameters: [f], summary: 'Landing page', responses: { '200': jsonOk('Links to the API definition, conformance and collections'), '400': problem } } },
      '/api': { get: { operationId: 'getApiDefinition', parameters: [f], summary: 'This document', responses: { '200': { description: 'OpenAPI 3.0 definition', content: { 'application/vnd.oai.openapi+json;version=3.0': { schema: { type: 'object' } } } } } } },
      '/conformance': { get: { operationId: 'getConformance', parameters: [f], summary: 'Conformance classes', responses: { '200': jsonOk('conformsTo list'), '400': problem } } },
      '/collections': { get: { operationId: 'getCollections', parameters: [f], summary: 'Feature collections', responses: { '200': jsonOk('The collections'), '400': problem } } },
      '/collections/{collectionId}': { get: { operationId: 'describeCollection', parameters: [collectionId, f], responses: { '200': jsonOk('One collection'), '400': problem, '404': problem } } },
      '/collections/{collectionId}/items': {
        get: {
          operationId: 'getFeatures',
          parameters: [
            collectionId,
            f,
            { name: 'limit', in: 'query', required: false, style: 'form', explode: false, schema: { type: 'integer', minimum: 1, maximum: ogcMaxLimit, default: ogcDefaultLimit } },
            { name: 'offset', in: 'query', required: false, schema: { type: 'integer', minimum: 0, default: 0 }, description: 'Paging offset used by the next links' },
            { name: 'bbox', in: 'query', required: false, style: 'form', explode: false, schema: { type: 'array', minItems: 4, maxItems: 6, items: { type: 'number' } } },
            { name: 'datetime', in: 'query', required: false, style: 'form', explode: false, schema: { type: 'string' } },
          ],
          responses: { '200': geoOk('A page of features'), '400': problem, '404': problem },
        },
      },
      '/collections/{collectionId}/items/{featureId}': {
        get: {
          operationId: 'getFeature',
          parameters: [collectionId, { name: 'featureId', in: 'path', required: true, schema: { type: 'string' } }, f],
          responses: { '200': geoOk('One feature'), '400': problem, '404': problem },
        },
      },
    },
  };
}
