import type TestAgent from 'supertest/lib/agent';
import type { Geometry } from 'geojson';

/** An irregular risk area around (lon, lat), half-size `size` degrees, counterclockwise. */
export function areaAround(lon: number, lat: number, size = 1): Geometry {
  return {
    type: 'Polygon',
    coordinates: [[[lon - size, lat - size * 0.8], [lon + size, lat - size], [lon + size * 1.2, lat + size * 0.6], [lon - size * 0.3, lat + size], [lon - size, lat - size * 0.8]]],
  };
}

export interface AreaSpec {
  levelKey: string;
  geometry: Geometry;
  hazards?: { hazard: 'tornado' | 'hail' | 'wind' | 'flood'; significant: boolean }[];
}

async function expectStatus(res: { status: number; body: unknown }, status: number, what: string) {
  if (res.status !== status) throw new Error(`${what}: ${res.status} ${JSON.stringify(res.body)}`);
}

/** Saves areas, submits, approves and publishes an outlook over HTTP; returns the issuance number. */
async function saveAndPublish(forecaster: TestAgent, lead: TestAgent, outlookId: string, areas: AreaSpec[], headline: string): Promise<string> {
  const current = await forecaster.get(`/api/outlooks/${outlookId}`);
  await expectStatus(current, 200, 'read outlook');
  const saved = await forecaster.put(`/api/outlooks/${outlookId}`).send({
    version: current.body.version, headline, discussion: 'Moist warm sector under a strong mid-level jet.', hazardNotes: {}, validFrom: current.body.validFrom, validUntil: current.body.validUntil,
    areas: areas.map((a) => ({ levelKey: a.levelKey, hazards: a.hazards ?? [], geometry: a.geometry })),
  });
  await expectStatus(saved, 200, 'save outlook');
  const post = (agent: TestAgent, action: string, version: number) => agent.post(`/api/outlooks/${outlookId}/${action}`).send({ version });
  const submitted = await post(forecaster, 'submit', saved.body.version);
  await expectStatus(submitted, 200, 'submit');
  const approved = await post(lead, 'approve', submitted.body.version);
  await expectStatus(approved, 200, 'approve');
  const published = await post(lead, 'publish', approved.body.version);
  await expectStatus(published, 200, 'publish');
  return published.body.issuanceNumber as string;
}

/** Creates and publishes an outlook for `day` issued at `issuanceTime` (ISO); returns the issuance number. */
export async function publishOutlook(forecaster: TestAgent, lead: TestAgent, input: { day: number; issuanceTime: string; headline: string; areas: AreaSpec[] }): Promise<string> {
  const created = await forecaster.post('/api/outlooks').send({ day: input.day, issuanceTime: input.issuanceTime, headline: input.headline });
  await expectStatus(created, 201, 'create outlook');
  return saveAndPublish(forecaster, lead, created.body.id as string, input.areas, input.headline);
}

/** Amends a published issuance with new areas and publishes the amendment; returns the new number. */
export async function amendAndPublish(forecaster: TestAgent, lead: TestAgent, number: string, areas: AreaSpec[], headline: string): Promise<string> {
  const amend = await forecaster.post(`/api/issuances/${number}/amend`).send({});
  await expectStatus(amend, 201, 'amend');
  return saveAndPublish(forecaster, lead, amend.body.outlookId as string, areas, headline);
}
