import type { ApiAgent } from './test-app';

/** Creates a garden, an active paired trial with two pairs, and a pot in each olla plot, through the API. */
export async function makePairedTrial(a: ApiAgent, opts: { plantingDate?: string; title?: string; timeZone?: string } = {}) {
  const garden = (
    await a.post('/api/gardens', {
      name: 'Back yard',
      latitudeDeg: 35.0844,
      longitudeDeg: -106.6504,
      elevationM: 1500,
      soilTexture: 'sandy_loam',
      ...(opts.timeZone ? { timeZone: opts.timeZone } : {}),
    })
  ).body.data;
  const trialRes = await a.post(`/api/gardens/${garden.id}/trials`, {
    title: opts.title ?? 'Tomatoes 2026',
    crop: 'tomato',
    plantingDate: opts.plantingDate ?? '2026-05-01',
    design: 'paired',
  });
  if (trialRes.status !== 201) throw new Error(`trial: ${trialRes.status} ${JSON.stringify(trialRes.body)}`);
  const trial = trialRes.body.data;
  const plots = [];
  for (const [label, blockKey] of [
    ['A1', 'A'],
    ['A2', 'A'],
    ['B1', 'B'],
    ['B2', 'B'],
  ] as const) {
    plots.push((await a.post(`/api/trials/${trial.id}/plots`, { label, blockKey, areaM2: 2 })).body.data);
  }
  const randomised = (await a.post(`/api/trials/${trial.id}/randomise`, { seed: 'fixture-seed' })).body.data;
  await a.post(`/api/trials/${trial.id}/status`, { status: 'active' });
  const ollaPlots = randomised.plots.filter((p: { treatment: string }) => p.treatment === 'olla');
  const pots = [];
  for (const [i, p] of ollaPlots.entries()) {
    pots.push(
      (await a.post('/api/pots', { label: `Pot ${i + 1}`, capacityL: 10, widestDiameterCm: 28, shape: 'globe', make: 'wheel_thrown', plotId: p.id })).body.data,
    );
  }
  return { garden, trial, plots: randomised.plots as { id: string; label: string; treatment: string; blockKey: string }[], pots };
}
