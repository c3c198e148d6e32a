// The invented demo school. README lists these accounts; tests sign in with them.
import type { Role } from '../src/lib/roles';

export const DEMO_PASSWORD = 'wren-bench-160';
export const DEMO_SCHOOL = 'Larkspur Valley Technical School';

export const DEMO_PEOPLE: { name: string; email: string; role: Role }[] = [
  { name: 'Priya Castellanos', email: 'admin@larkspur.example', role: 'admin' },
  { name: 'Dana Whitcombe', email: 'instructor@larkspur.example', role: 'instructor' },
  { name: 'Marcus Oyelaran', email: 'instructor2@larkspur.example', role: 'instructor' },
  { name: 'Ava Lindqvist', email: 'learner1@larkspur.example', role: 'learner' },
  { name: 'Ben Okafor', email: 'learner2@larkspur.example', role: 'learner' },
  { name: 'Carmen Ruiz', email: 'learner3@larkspur.example', role: 'learner' },
  { name: 'Deshawn Price', email: 'learner4@larkspur.example', role: 'learner' },
  { name: 'Elif Aydın', email: 'learner5@larkspur.example', role: 'learner' },
  { name: 'Finn Gallagher', email: 'learner6@larkspur.example', role: 'learner' },
  { name: 'Grace Tanaka', email: 'learner7@larkspur.example', role: 'learner' },
  { name: 'Hugo Marchetti', email: 'learner8@larkspur.example', role: 'learner' },
];

export const DEMO_CLASS = {
  name: 'Small Engines I',
  // Fixed so the demo can be followed from the README; letters from the join-code alphabet.
  joinCode: 'WREN4SMA',
  instructors: ['instructor@larkspur.example'],
  learners: DEMO_PEOPLE.filter((p) => p.role === 'learner').map((p) => p.email),
};
