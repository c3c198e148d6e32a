import { encodePng } from '../../../scripts/demo-photo';
import { Client, demoUser, newLearner } from './client';

/** A fresh instructor: signed up, promoted by the demo admin, signed in. */
export async function newInstructor(tag: string) {
  const made = await newLearner(tag);
  const admin = (await demoUser('admin@larkspur.example')).client;
  const res = await admin.patch(`/api/admin/users/${made.user.id}`, { role: 'instructor' });
  if (res.status !== 200) throw new Error(`could not promote ${tag}: ${res.status}`);
  return made;
}

async function classWith(instructor: Client, name: string) {
  const res = await instructor.post('/api/classes', { name });
  if (res.status !== 201) throw new Error(`class not created: ${res.status}`);
  return res.body as { id: string; joinCode: string };
}

async function join(learner: Client, joinCode: string) {
  const res = await learner.post('/api/classes/join', { joinCode });
  if (res.status !== 200) throw new Error(`join failed: ${res.status}`);
}

/**
 * Two classes with their own instructors: the owner learns in class A; another learner in class B.
 * Every test file gets new people, so nothing depends on what other files left behind.
 */
export async function benchWorld() {
  const instructorA = await newInstructor('teacher-a');
  const instructorB = await newInstructor('teacher-b');
  const classA = await classWith(instructorA.client, 'Bench class A');
  const classB = await classWith(instructorB.client, 'Bench class B');
  const owner = await newLearner('owner');
  const otherLearner = await newLearner('other');
  await join(owner.client, classA.joinCode);
  await join(otherLearner.client, classB.joinCode);
  const admin = (await demoUser('admin@larkspur.example')).client;
  return { instructorA, instructorB, classA, classB, owner, otherLearner, admin, anonymous: new Client() };
}

/** A small real PNG (different pixels per colour, so two uploads differ). */
export function pngBytes(rgb: [number, number, number] = [180, 120, 40], size = 4) {
  return encodePng(size, size, () => rgb);
}

export function photoForm(bytes: Uint8Array, name = 'sump.png', procedure = 'wren-160-sump', type = 'image/png') {
  const form = new FormData();
  form.set('purpose', 'bench-photo');
  form.set('procedure', procedure);
  form.set('file', new Blob([bytes as Uint8Array<ArrayBuffer>], { type }), name);
  return form;
}
