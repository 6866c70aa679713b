import type { Agent } from './api';

/** Sizes a whole site through the API and waits for the job to finish (throws when it fails or hangs). */
export async function sizeSiteAndWait(agent: Agent, siteId: number): Promise<void> {
  const res = await agent.post(`/api/v1/sites/${siteId}/sizing`).set('X-CSRF-Token', agent.csrf).send({}).expect(202);
  for (let i = 0; i < 1200; i++) {
    const job = (await agent.get(`/api/v1/jobs/${res.body.job.id}`).expect(200)).body.job;
    if (job.status === 'done') return;
    if (job.status === 'failed') throw new Error(`sizing failed: ${job.error}`);
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error('sizing did not finish');
}
