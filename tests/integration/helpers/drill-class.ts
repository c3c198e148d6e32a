import { randomUUID } from 'node:crypto';
import type { Client } from './client';
import { demoUser, newLearner } from './client';

/** An instant `days` from now, as the API takes it. */
export const inDays = (days: number) => new Date(Date.now() + days * 24 * 60 * 60 * 1000).toISOString();

/** A fresh class taught by the demo instructor, with `count` new learners in it. */
export async function classWithLearners(count: number, tag: string) {
  const instructor = (await demoUser('instructor@larkspur.example')).client;
  const created = await instructor.post('/api/classes', { name: `Drills ${tag} ${randomUUID().slice(0, 6)}` });
  if (created.status !== 201) throw new Error(`class not created: ${created.status}`);
  const { id: classId, name, joinCode } = created.body as { id: string; name: string; joinCode: string };
  const learners: { client: Client; email: string; user: { id: string } }[] = [];
  for (let i = 0; i < count; i++) {
    const learner = await newLearner(`${tag}${i}`);
    const joined = await learner.client.post('/api/classes/join', { joinCode });
    if (joined.status !== 200) throw new Error(`join failed: ${joined.status}`);
    learners.push(learner);
  }
  return { instructor, classId, className: name, joinCode, learners };
}
