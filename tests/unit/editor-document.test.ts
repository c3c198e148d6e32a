import { describe, expect, it } from 'vitest';
import { get } from 'react-hook-form';
import { DEMO_PROCEDURES } from '@models/procedures';
import { blankDocument, cloneDocument, editDocument, validateDraft } from '~/lib/editor/drafts';
import { flattenErrors, issuesToErrors } from '~/lib/editor/issues';
import { anchorFromLibrary, anchorsOfParts, boltKeyFor, partFromModel } from '~/lib/editor/library';
import { newStepKey } from '~/lib/editor/keys';
import { tighteningPreview } from '~/lib/editor/preview';
import { slugify, uniqueSlug } from '~/lib/editor/slug';
import { fromEditorValues, toEditorValues, type EditorValues } from '~/lib/editor/values';
import { validateProcedure } from '~/lib/procedure/validate';
import type { Procedure } from '~/lib/procedure/schema';
import { getModel } from '@models/index';
import { coverProcedure } from '../support/cover-procedure';

function valid(input: unknown): Procedure {
  const r = validateProcedure(input);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.procedure;
}

/** The editor's values for a valid document, changed, then checked as the editor checks before publishing. */
/** The message react-hook-form would show at a path. */
const messageAt = (errors: Record<string, unknown>, path: string) => (get(errors, path) as { message?: string } | undefined)?.message;

function issuesAfter(change: (v: EditorValues) => void) {
  const values = toEditorValues(coverProcedure());
  change(values);
  const result = validateDraft(fromEditorValues(values));
  if (result.ok) throw new Error('expected the draft to be refused');
  return { issues: result.issues, errors: issuesToErrors(result.issues) };
}

describe('form values ⇄ document', () => {
  it('every demo procedure and the cover job survive the editor unchanged', () => {
    for (const input of [...DEMO_PROCEDURES, coverProcedure()]) {
      const doc = valid(input);
      const back = valid({ ...fromEditorValues(toEditorValues(doc)), version: doc.version });
      expect(back).toEqual(doc);
    }
  });

  it('reads anything a half-built draft may hold without throwing, and keeps empty numbers empty', () => {
    const values = toEditorValues({ title: 7, parts: [{ key: 'x', count: null }, 'junk'], steps: 'none', fastenerGroups: [{ passes: [null, 1] }] });
    expect(values.title).toBe('');
    expect(values.parts[0]).toMatchObject({ key: 'x', count: 1, kind: 'block' });
    expect(values.steps).toEqual([]);
    expect(values.fastenerGroups[0]!.passes[0]).toBeNaN();
    expect(toEditorValues(null).stages).toEqual([]);
  });

  it('keeps the wrench task and final check only while the form says the document has them', () => {
    const values = toEditorValues(coverProcedure());
    values.hasWrench = false;
    values.hasFinalCheck = false;
    const doc = fromEditorValues(values);
    expect(doc).not.toHaveProperty('wrench');
    expect(doc).not.toHaveProperty('finalCheck');
  });

  it('marks read from a document written by marks are exact; the demo sump keeps its own constraints', () => {
    expect(toEditorValues(coverProcedure())).toMatchObject({ anyOrder: [false, false, true, false, false], customOrder: false });
    expect(toEditorValues(DEMO_PROCEDURES[0]).customOrder).toBe(true);
  });
});

describe('the editor refuses what publishing would refuse, naming the key, at the field that caused it', () => {
  it('a cycle', () => {
    const { issues, errors } = issuesAfter((v) => {
      v.steps[0]!.after = ['step-seat'];
    });
    expect(issues).toContainEqual({ path: 'steps.0.after', message: 'steps form a cycle: step-pins → step-seat → step-gasket → step-pins' });
    expect(messageAt(errors, 'steps.0.after')).toContain('step-seat');
  });

  it('a missing part', () => {
    const { issues, errors } = issuesAfter((v) => {
      v.steps[1]!.parts = ['sump-gasket', 'head-gasket'];
    });
    expect(issues).toEqual([{ path: 'steps.1.parts.1', message: 'step step-gasket names part head-gasket, which is not in the parts list' }]);
    expect(messageAt(errors, 'steps.1.parts.1')).toContain('head-gasket');
  });

  it('a pin without a hole', () => {
    const { issues, errors } = issuesAfter((v) => {
      v.pinSeats = [];
    });
    expect(issues).toContainEqual({ path: 'parts.3', message: 'pin dowel-pin-8 has no hole' });
    expect(messageAt(errors, 'parts.3')).toBe('pin dowel-pin-8 has no hole');
  });

  it('an empty number says so in plain words, and the slug problem shows at the title', () => {
    const { errors } = issuesAfter((v) => {
      v.fastenerGroups[0]!.torque.value = Number.NaN;
      v.title = '';
    });
    expect(messageAt(errors, 'fastenerGroups.0.torque.value')).toBe('Enter a number');
    expect(messageAt(errors, 'title')).toBe('Required');
  });

  it('an empty key says "Required" once, not also that it breaks the key pattern', () => {
    const { errors } = issuesAfter((v) => {
      v.wrench.group = '';
    });
    expect(messageAt(errors, 'wrench.group')).toBe('Required');
  });

  it('several problems at one path are kept together, and a list problem does not hide its items', () => {
    const errors = issuesToErrors([
      { path: 'steps.2', message: 'first' },
      { path: 'steps.2', message: 'second' },
      { path: 'steps.2.text', message: 'text problem' },
      { path: '', message: 'whole document' },
    ]);
    expect(messageAt(errors, 'steps.2')).toBe('first · second');
    expect(messageAt(errors, 'steps.2.text')).toBe('text problem');
    expect(flattenErrors(errors)).toEqual([
      { path: 'steps.2', message: 'first · second' },
      { path: 'steps.2.text', message: 'text problem' },
      { path: 'root', message: 'whole document' },
    ]);
  });

  it('a blank new draft is refused with a problem for each missing piece', () => {
    const result = validateDraft(blankDocument());
    expect(result.ok).toBe(false);
    if (result.ok) return;
    const paths = result.issues.map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['title', 'cautions', 'parts', 'steps']));
  });
});

describe('clone and edit documents', () => {
  it('a clone drops slug and version and says "(copy)"; an edit keeps the slug', () => {
    const sump = valid(DEMO_PROCEDURES[0]);
    const clone = cloneDocument(sump);
    expect(clone).not.toHaveProperty('slug');
    expect(clone).not.toHaveProperty('version');
    expect(clone.title).toBe('Wren 160: install the sump (copy)');
    expect(clone.steps).toEqual(sump.steps);
    expect(editDocument(sump)).toMatchObject({ slug: 'wren-160-sump', title: sump.title });
    expect(editDocument(sump)).not.toHaveProperty('version');
  });

  it('a clone of a long title stays within the title limit', () => {
    const sump = valid({ ...DEMO_PROCEDURES[0], title: 'x'.repeat(120) });
    expect((cloneDocument(sump).title as string).length).toBeLessThanOrEqual(120);
  });
});

describe('slugs and keys', () => {
  it('makes slugs that pass the key rule', () => {
    expect(slugify('Wren 160: install the sump (copy)')).toBe('wren-160-install-the-sump-copy');
    expect(slugify('Bougie d’allumage — réglage')).toBe('bougie-d-allumage-reglage');
    expect(slugify('!!!')).toBe('');
    expect(slugify('a'.repeat(80))).toHaveLength(64);
  });

  it('finds the next free slug', () => {
    const taken = new Set(['cover', 'cover-2']);
    expect(uniqueSlug('cover', (s) => taken.has(s))).toBe('cover-3');
    expect(uniqueSlug('', () => false)).toBe('procedure');
    const long = 'a'.repeat(64);
    expect(uniqueSlug(long, (s) => s === long)).toBe(`${'a'.repeat(62)}-2`);
  });

  it('new step keys are random, unique and give no order away', () => {
    let n = 0;
    const sequence = [0, 0, 0, 0, 0.5, 0.5, 0.5, 0.5];
    const random = () => sequence[n++ % sequence.length]!;
    const first = newStepKey([], random);
    expect(first).toMatch(/^step-[a-z0-9]{4}$/);
    expect(newStepKey([first], random)).not.toBe(first);
  });
});

describe('the part library', () => {
  it('a part taken from a model carries its kind and pin size, and a second copy gets its own key', () => {
    const pin = getModel('dowel-pin-8')!;
    expect(partFromModel(pin, [])).toEqual({ key: 'dowel-pin-8', name: '8 mm dowel pin', kind: 'dowel-pin', model: 'dowel-pin-8', count: 1, pin: { diameterMm: 8, lengthMm: 14 }, decoy: false });
    expect(partFromModel(pin, ['dowel-pin-8']).key).toBe('dowel-pin-8-2');
    expect(partFromModel(getModel('flange-bolt')!, [])).not.toHaveProperty('pin');
  });

  it('anchors come from the models of the parts in the kit, on those parts', () => {
    const parts = [{ key: 'case', model: 'crankcase' }];
    expect(anchorsOfParts(parts, ['locating-hole']).map((a) => a.anchor.key)).toEqual(['dowel-hole-a', 'dowel-hole-b', 'sleeve-hole-a', 'sleeve-hole-b']);
    expect(anchorFromLibrary('sump-bolt-3', parts)).toMatchObject({ key: 'sump-bolt-3', part: 'case', kind: 'threaded-hole', sizeMm: 6 });
    expect(anchorFromLibrary('sump-bolt-3', [])).toBeNull();
    expect(anchorFromLibrary('no-such-hole', parts)).toBeNull();
  });

  it('bolt keys follow the hole number, falling back to the hole key when taken', () => {
    expect(boltKeyFor('sump-bolt-3', [])).toBe('bolt-3');
    expect(boltKeyFor('head-bolt-3', ['bolt-3'])).toBe('head-bolt-3');
    expect(boltKeyFor('crank-thread', [])).toBe('crank-thread');
  });
});

describe('tightening preview', () => {
  it('four bolts on a circle in the cross pattern: 1-3-2-4', () => {
    // Cross pattern for 4 bolts numbered round the circle: 1-3-2-4, from memory of ASME PCC-1 (legacy cross pattern).
    // The cover uses every other sump hole, so its bolts 1..4 round the circle are holes 1, 3, 5, 7.
    const doc = valid(coverProcedure());
    const preview = tighteningPreview(doc.fastenerGroups[0]!, doc.anchors);
    expect(preview).toMatchObject({ ok: true, sequence: ['bolt-1', 'bolt-5', 'bolt-3', 'bolt-7'] });
  });

  it('says when a bolt has no hole on the model yet, and shows nothing for a group without bolts', () => {
    const doc = valid(coverProcedure());
    expect(tighteningPreview(doc.fastenerGroups[0]!, [])).toEqual({ ok: false, message: 'Bolt bolt-1 has no hole on the model yet.' });
    expect(tighteningPreview({ ...doc.fastenerGroups[0]!, bolts: [] }, doc.anchors)).toBeNull();
  });
});
