import { randomUUID } from 'node:crypto';
import { expect, test, type Page } from '@playwright/test';
import { validateProcedure } from '../../src/lib/procedure/validate';
import type { Procedure } from '../../src/lib/procedure/schema';
import { COVER_BOLT_HOLES, COVER_STEPS } from '../support/cover-procedure';
import { islandsReady, shot, signIn, signOut } from './helpers';
import { answerStage, checkStage, openStage, press, signUpLearner } from './trainer-steps';

// An instructor builds a small four-bolt cover job from the part library in the editor, publishes it and
// assigns it to the class, and a learner then does every stage of the drill in the trainer with full marks.

test.describe.configure({ timeout: 300_000 });

const step = (page: Page, n: number) => page.getByRole('group', { name: `Step ${n}`, exact: true });
const part = (page: Page, name: string) => page.getByRole('group', { name, exact: true });

async function addPart(page: Page, modelName: string) {
  await page.getByLabel('Part from the library').selectOption({ label: modelName });
  await page.getByRole('button', { name: 'Add part' }).click();
  await expect(part(page, modelName.replace(/ \(.*\)$/, ''))).toBeVisible();
}

async function addStep(page: Page, n: number, text: string, partNames: string[]) {
  await page.getByRole('button', { name: 'Add a step' }).click();
  await step(page, n).getByLabel(`Step ${n}: what the learner does`).fill(text);
  for (const name of partNames) await step(page, n).getByRole('checkbox', { name, exact: true }).check();
}

const text = (key: string) => COVER_STEPS.find((s) => s.key === key)!.text;

test('an instructor builds a four-bolt cover procedure, publishes it, assigns it, and a learner completes it with full marks', async ({ page }) => {
  const title = `Sump cover, four-bolt practice ${randomUUID().slice(0, 4)}`;
  await signIn(page, 'instructor@larkspur.example');
  await page.getByRole('link', { name: /Procedures: build/ }).click();
  await page.getByRole('button', { name: 'New procedure' }).click();
  await expect(page.getByRole('heading', { name: 'New procedure', level: 1 })).toBeVisible();

  // Details.
  await page.getByLabel('Title').fill(title);
  await page.getByLabel('Summary').fill("Fit the sump cover on four flange bolts. Demo values for a fictional engine; real work uses the engine maker's specifications.");
  await page.getByRole('button', { name: 'Add the standard cautions' }).click();
  await page.getByLabel(/^Demo values/).check();
  for (const stage of ['Pins', 'Pattern', 'Wrench', 'Final check']) {
    await page.getByRole('group', { name: 'Stages learners do' }).getByRole('checkbox', { name: new RegExp(`^${stage} —`) }).check();
  }

  // Parts from the library.
  for (const name of ['Crankcase (block)', 'Sump cover (cover)', 'Sump gasket (gasket)', '8 mm dowel pin (dowel-pin)', '10 mm dowel pin (dowel-pin)', 'Flange bolt M6 (bolt)']) {
    await addPart(page, name);
  }
  await part(page, 'Sump gasket').getByLabel('Name in class').fill('New sump gasket');
  await part(page, '8 mm dowel pin').getByLabel('In the kit').fill('2');
  await part(page, '10 mm dowel pin').getByLabel('Decoy').check();
  await part(page, 'Flange bolt M6').getByLabel('In the kit').fill('4');

  // Steps, added out of order and then put right with the buttons and by keyboard drag.
  await addStep(page, 1, text('step-pins'), ['8 mm dowel pin']);
  await addStep(page, 2, text('step-gasket'), ['New sump gasket']);
  await addStep(page, 3, text('step-bolts'), ['Flange bolt M6']);
  await addStep(page, 4, text('step-seat'), ['Sump cover', 'Crankcase']);
  await addStep(page, 5, text('step-face'), ['Sump cover']);
  await step(page, 5).getByRole('button', { name: /^Up/ }).click();
  await step(page, 4).getByRole('button', { name: /^Up/ }).click();
  // Steps now: pins, gasket, face, bolts, seat. Pick up "bolts" (4) with Space, move it down one, drop it.
  // Each key waits for the announcement of the one before, as a screen reader user hears it.
  const announced = page.getByRole('status').filter({ hasText: /step|position/i });
  const handle = step(page, 4).getByRole('button', { name: 'Drag step 4 to a new place' });
  await press(page, handle, 'Space');
  await expect(handle).toHaveAttribute('aria-pressed', 'true');
  await page.keyboard.press('ArrowDown');
  await expect(announced).toContainText('Step 4 is over position 5');
  await page.keyboard.press('Space');
  await expect(announced).toContainText(`Dropped at position 5: ${text('step-bolts')}`);
  await expect(step(page, 5).getByLabel('Step 5: what the learner does')).toHaveValue(text('step-bolts'));
  await expect(step(page, 4).getByLabel('Step 4: what the learner does')).toHaveValue(text('step-seat'));
  await step(page, 3).getByLabel('May come in any order with the previous step').check();
  const graph = page.getByTestId('precedence-graph');
  await expect(graph).toContainText('Resulting order: 4 columns');
  await expect(graph).toContainText('Step 3 comes after step 1');
  await expect(graph).toContainText('Step 4 comes after steps 2, 3');

  // An empty required field is named beside it (and in the list at the top) when the instructor checks.
  await page.getByRole('button', { name: 'Check for problems' }).click();
  await expect(page.getByTestId('issue-summary')).toBeVisible();
  await expect(page.getByRole('group', { name: 'Wrench task' })).toContainText('⚠ Required');
  await shot(page, 'editor-problems');

  // The fastener group on every other sump bolt hole, 11 N·m in two passes, cross pattern.
  await page.getByRole('button', { name: 'Add a fastener group' }).click();
  const group = page.getByRole('group', { name: 'Fastener group 1' });
  await group.getByLabel('Group name').fill('Cover bolts');
  await group.getByLabel('Fastener part').selectOption({ label: 'Flange bolt M6 (4 in the kit)' });
  for (const hole of COVER_BOLT_HOLES) await group.getByLabel(`Sump bolt ${hole.slice(-1)} · threaded · 6\u00a0mm`).check();
  await group.getByLabel('Torque spec').fill('11');
  await group.getByLabel('Tolerance, ± %').fill('10');
  // Cross pattern for four bolts round a circle: 1-3-2-4 (from memory of ASME PCC-1), here holes 1, 5, 3, 7.
  await expect(page.getByRole('list', { name: 'Accepted tightening sequence' })).toHaveText(['Bolt 1', 'Bolt 5', 'Bolt 3', 'Bolt 7'].join(''));

  // Wrench and final check.
  await expect(page.getByLabel('Spec from group')).toHaveValue('bolts');
  await page.getByRole('button', { name: 'Use the bolt count (4)' }).click();
  await page.getByLabel('Crankshaft turns without binding').fill('1');

  // With the fields complete, the cross-checks speak: the pins have no holes yet.
  await expect(part(page, '8 mm dowel pin')).toContainText('pin dowel-pin-8 has no hole');
  await shot(page, 'editor-pin-without-hole');

  // Pins into the dowel holes.
  for (const [n, hole] of [[1, 'Dowel hole A'], [2, 'Dowel hole B']] as const) {
    await page.getByRole('button', { name: 'Add a pin seat' }).click();
    const seat = page.getByRole('group', { name: `Pin seat ${n}` });
    await seat.getByLabel('Pin').selectOption({ label: '8 mm dowel pin (8 × 14\u00a0mm)' });
    await seat.getByLabel('Hole').selectOption({ label: `${hole} · locating · 8\u00a0mm` });
  }
  await expect(part(page, '8 mm dowel pin')).not.toContainText('has no hole');

  // The draft is saved as it goes and comes back after a reload.
  await expect(page.locator('[data-save-status="saved"]')).toBeVisible({ timeout: 15_000 });
  await page.reload();
  await expect(page.getByLabel('Title')).toHaveValue(title);
  await expect(page.getByRole('list', { name: 'Accepted tightening sequence' })).toHaveText(['Bolt 1', 'Bolt 5', 'Bolt 3', 'Bolt 7'].join(''));
  await page.getByRole('button', { name: 'Check for problems' }).click();
  await expect(page.getByText('No problems found: ready to publish.')).toBeVisible();
  await shot(page, 'editor-ready');

  await page.getByRole('button', { name: 'Publish', exact: true }).click();
  await expect(page.getByTestId('published')).toContainText('version 1');
  const slug = new URL(page.url()).searchParams.get('published')!;
  expect(slug).toMatch(/^sump-cover-four-bolt-practice-/);
  await expect(page.getByTestId('my-procedures')).toContainText(title);
  await shot(page, 'editor-published');

  // What was published: the document as the class will be scored on it.
  const exported = await page.request.get(`/api/procedures/${slug}/export`);
  const checked = validateProcedure((await exported.json()).procedure);
  if (!checked.ok) throw new Error(JSON.stringify(checked.issues));
  const procedure: Procedure = checked.procedure;
  expect(procedure.steps.map((s) => s.text)).toEqual(['step-pins', 'step-gasket', 'step-face', 'step-seat', 'step-bolts'].map(text));
  expect(procedure.pinSeats).toEqual([
    { part: 'dowel-pin-8', anchor: 'dowel-hole-a' },
    { part: 'dowel-pin-8', anchor: 'dowel-hole-b' },
  ]);
  expect(procedure.fastenerGroups[0]).toMatchObject({ part: 'flange-bolt', torque: { value: 11, unit: 'N·m', tolerancePct: 10 }, passes: [0.5, 1], rule: 'cross' });
  expect(procedure.parts.find((p) => p.key === 'dowel-pin-10')).toMatchObject({ decoy: true });

  // The instructor assigns it to the class as a drill on every stage.
  await page.goto('/teach');
  await page.getByRole('link', { name: 'Small Engines I', exact: true }).click();
  await islandsReady(page);
  const assign = page.getByRole('form', { name: 'Assign a drill' });
  await assign.getByLabel('Procedure').selectOption({ label: `${title} (version 1)` });
  await assign.getByLabel('Due date and time').fill('2031-09-01T17:00');
  await assign.getByLabel('Pass mark (%)').fill('100');
  const created = page.waitForResponse((r) => r.request().method() === 'POST' && /\/api\/classes\/[^/]+\/drills$/.test(r.url()));
  await assign.getByRole('button', { name: 'Assign drill' }).click();
  const drill = (await (await created).json()) as { id: string; stages: string[] };
  expect(drill.stages).toEqual(procedure.stages);
  await signOut(page);

  // A new learner of the class opens the drill from their page and does every stage in the trainer.
  await signUpLearner(page);
  expect((await page.request.post('/api/classes/join', { data: { joinCode: 'WREN4SMA' } })).status()).toBe(200);
  await page.goto('/learn');
  await page.locator(`[data-drill-id="${drill.id}"]`).getByRole('link', { name: title }).click();
  await expect(page).toHaveURL(new RegExp(`/train/${slug}\\?drill=${drill.id}$`));
  await expect(page.getByRole('tablist', { name: 'Stages' })).toBeVisible();
  await expect(page.getByRole('heading', { name: title, level: 1 })).toBeVisible();
  for (const stage of procedure.stages) {
    await openStage(page, stage);
    await answerStage(page, procedure, stage);
    const verdict = await checkStage(page);
    await expect(verdict).toHaveText(/^(✓ )?Passed/);
    await expect(verdict).toContainText(/(\d+) of \1$/);
  }
  await expect(page.getByRole('tab', { name: /Passed/ })).toHaveCount(procedure.stages.length);
  await shot(page, 'editor-cover-learner-done');
  await page.goto('/learn');
  await expect(page.locator(`[data-drill-id="${drill.id}"]`)).toContainText('Passed');
});

/** Where the fastener group's 3D view draws a hole or bolt, in viewport pixels (the scene's own test hook). */
async function projected(page: Page, scene: string, key: string): Promise<{ x: number; y: number }> {
  await page.getByTestId(`bolt-scene-${scene}`).scrollIntoViewIfNeeded();
  const point = await page.evaluate(
    ([s, k]) => (window as unknown as { __bwScenes: Record<string, { project(k: string): { x: number; y: number } | null }> }).__bwScenes[s]!.project(k),
    [scene, key] as const,
  );
  if (!point) throw new Error(`no screen position for ${key}`);
  return point;
}

/** Bolt key → the number drawn on it, in the 3D view's tags or on the 2D bolt map. */
async function numbers(page: Page, selector: string): Promise<Record<string, string>> {
  return page.locator(selector).evaluateAll((nodes) => Object.fromEntries(nodes.map((n) => [n.getAttribute('data-bolt'), n.textContent?.trim()])));
}

test('an instructor picks bolt positions on the 3D part, and the list, the bolt map and the model agree on the sequence', async ({ page }) => {
  await signIn(page, 'instructor@larkspur.example');
  await page.goto('/teach/procedures');
  await page.getByRole('button', { name: 'New procedure' }).click();
  await expect(page.getByRole('heading', { name: 'New procedure', level: 1 })).toBeVisible();
  await page.getByLabel('Title').fill(`Sump cover picked on the model ${randomUUID().slice(0, 4)}`);
  for (const name of ['Crankcase (block)', 'Sump cover (cover)', 'Flange bolt M6 (bolt)']) await addPart(page, name);
  await part(page, 'Flange bolt M6').getByLabel('In the kit').fill('4');
  await page.getByRole('button', { name: 'Add a fastener group' }).click();
  const group = page.getByRole('group', { name: 'Fastener group 1' });
  await group.getByLabel('Group name').fill('Cover bolts');
  await expect(group.getByLabel('Fastener part')).toHaveValue('flange-bolt');

  // project() answers in viewport pixels: the whole canvas must fit on screen.
  await page.setViewportSize({ width: 1280, height: 1100 });
  const scene = page.getByTestId('bolt-scene-group-1');
  await scene.scrollIntoViewIfNeeded();
  await expect(group).toContainText('Click a threaded hole to put a bolt in it');
  await page.waitForFunction(() => Boolean((window as unknown as { __bwScenes?: Record<string, unknown> }).__bwScenes?.['group-1']), null, { timeout: 60_000 });

  const holeBox = (hole: string) => group.getByLabel(`Sump bolt ${hole.slice(-1)} · threaded · 6\u00a0mm`);
  const sequence = page.getByRole('list', { name: 'Accepted tightening sequence' });
  const onModel = '[data-testid="bolt-scene-group-1"] [data-scene-label="order"]';
  const onMap = '[data-testid="bolt-preview-0"] g[data-bolt]';

  // Every other sump bolt hole, clicked where the 3D view draws it.
  for (const hole of COVER_BOLT_HOLES) {
    const { x, y } = await projected(page, 'group-1', hole);
    await page.mouse.click(x, y);
    await expect(holeBox(hole)).toBeChecked();
  }
  // Cross pattern for four bolts round a circle: 1-3-2-4 (from memory of ASME PCC-1), here holes 1, 5, 3, 7.
  const cross = { 'bolt-1': '1', 'bolt-5': '2', 'bolt-3': '3', 'bolt-7': '4' };
  await expect(sequence).toHaveText(['Bolt 1', 'Bolt 5', 'Bolt 3', 'Bolt 7'].join(''));
  await expect.poll(() => numbers(page, onModel)).toEqual(cross);
  expect(await numbers(page, onMap)).toEqual(cross);
  await page.mouse.move(5, 5);
  await scene.scrollIntoViewIfNeeded();
  await group.screenshot({ path: 'test-results/screens/editor-bolts-on-model.png' });

  // A click on a bolt takes it out: the list, the map and the model all lose it and renumber alike.
  const { x, y } = await projected(page, 'group-1', 'bolt-3');
  await page.mouse.click(x, y);
  await expect(holeBox('sump-bolt-3')).not.toBeChecked();
  await expect(sequence.getByRole('listitem')).toHaveCount(3);
  const listed = (await sequence.getByRole('listitem').allTextContents()).map((t) => `bolt-${t.replace('Bolt ', '')}`);
  const three = Object.fromEntries(listed.map((key, i) => [key, String(i + 1)]));
  expect(Object.keys(three).sort()).toEqual(['bolt-1', 'bolt-5', 'bolt-7']);
  await expect.poll(() => numbers(page, onModel)).toEqual(three);
  expect(await numbers(page, onMap)).toEqual(three);
  await page.mouse.move(5, 5);
  await scene.scrollIntoViewIfNeeded();
  await group.screenshot({ path: 'test-results/screens/editor-bolt-removed-on-model.png' });

  // Back in on the model; the draft saves it as it saves the list's changes, and it comes back after a reload.
  const hole3 = await projected(page, 'group-1', 'sump-bolt-3');
  type Saved = { document: { fastenerGroups: { bolts: { anchor: string }[] }[] } };
  const anchorsSaved = (body: Saved) => body.document.fastenerGroups[0]?.bolts.map((b) => b.anchor).join(',');
  const saved = page.waitForResponse(
    (r) => r.request().method() === 'PUT' && r.ok() && anchorsSaved(r.request().postDataJSON() as Saved) === COVER_BOLT_HOLES.join(','),
  );
  await page.mouse.click(hole3.x, hole3.y);
  await expect(holeBox('sump-bolt-3')).toBeChecked();
  await expect(sequence).toHaveText(['Bolt 1', 'Bolt 5', 'Bolt 3', 'Bolt 7'].join(''));
  await saved;
  await page.reload();
  await expect(sequence).toHaveText(['Bolt 1', 'Bolt 5', 'Bolt 3', 'Bolt 7'].join(''));
  await page.getByTestId('bolt-scene-group-1').scrollIntoViewIfNeeded();
  await expect.poll(() => numbers(page, onModel), { timeout: 60_000 }).toEqual(cross);
});

test('without WebGL the editor says so where the 3D view would be, and the list and bolt map still do the job', async ({ page }) => {
  // A device without WebGL: every WebGL context request is refused, as such a browser does.
  await page.addInitScript(() => {
    const getContext = HTMLCanvasElement.prototype.getContext;
    HTMLCanvasElement.prototype.getContext = function (this: HTMLCanvasElement, kind: string, ...rest: unknown[]) {
      return /webgl/i.test(kind) ? null : (getContext as (...a: unknown[]) => RenderingContext | null).call(this, kind, ...rest);
    } as typeof getContext;
  });
  await signIn(page, 'instructor@larkspur.example');
  await page.goto('/teach/procedures');
  await page.getByRole('button', { name: 'New procedure' }).click();
  await expect(page.getByRole('heading', { name: 'New procedure', level: 1 })).toBeVisible();
  for (const name of ['Crankcase (block)', 'Flange bolt M6 (bolt)']) await addPart(page, name);
  await page.getByRole('button', { name: 'Add a fastener group' }).click();
  const group = page.getByRole('group', { name: 'Fastener group 1' });
  await expect(group).toContainText('The 3D view could not start on this device. The list above does the same.');
  for (const hole of COVER_BOLT_HOLES) await group.getByLabel(`Sump bolt ${hole.slice(-1)} · threaded · 6\u00a0mm`).check();
  // Cross pattern for four bolts round a circle: 1-3-2-4 (from memory of ASME PCC-1), here holes 1, 5, 3, 7.
  await expect(page.getByRole('list', { name: 'Accepted tightening sequence' })).toHaveText(['Bolt 1', 'Bolt 5', 'Bolt 3', 'Bolt 7'].join(''));
  await expect(page.getByTestId('bolt-preview-0').locator('g[data-bolt]')).toHaveCount(4);
});

test('a learner is refused the editor pages; another instructor cannot open a draft', async ({ page }) => {
  await signIn(page, 'instructor@larkspur.example');
  await page.goto('/teach/procedures');
  await page.getByRole('button', { name: 'New procedure' }).click();
  await expect(page.getByRole('heading', { name: 'New procedure', level: 1 })).toBeVisible();
  const editorUrl = page.url();
  await signOut(page);

  await signIn(page, 'instructor2@larkspur.example');
  const other = await page.goto(editorUrl);
  expect(other?.status()).toBe(404);
  await signOut(page);

  await signUpLearner(page);
  const learner = await page.goto('/teach/procedures');
  expect(learner?.status()).toBe(403);
});
