import { useMemo } from 'react';
import { Controller, useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { PATTERN_RULES, TORQUE_UNIT_IDS } from '../../lib/procedure/schema';
import { RULE_DESCRIPTIONS } from '../../lib/patterns';
import { boltScene } from '../../lib/editor/bolt-scene';
import { anchorAxis, anchorsOfParts, boltKeyFor, withAnchors } from '../../lib/editor/library';
import { tighteningPreview } from '../../lib/editor/preview';
import { uniqueSlug } from '../../lib/editor/slug';
import type { EditorValues } from '../../lib/editor/values';
import { holeLabel } from '../trainer/labels';
import { BoltModelView } from './BoltModelView';
import { BoltPreview } from './BoltPreview';
import { FieldIssue, useIssueProps } from './FieldIssue';
import { PassesField } from './PassesField';
import { Section } from './Section';

// Fastener groups: the bolt part, the holes it goes into (picked from the threaded holes of the parts in
// the kit, in the list or on the 3D part), the torque spec and passes, and the tightening rule, previewed
// as numbers on the 3D part and on a bolt map, both from one preview so they always agree.

const FASTENER_KINDS = ['bolt', 'nut', 'spark-plug'];

export function FastenersSection() {
  const { control, getValues, setValue } = useFormContext<EditorValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'fastenerGroups' });
  const add = () => {
    const keys = getValues('fastenerGroups').map((g) => g.key);
    const bolt = getValues('parts').find((p) => FASTENER_KINDS.includes(p.kind) && !p.decoy);
    const key = uniqueSlug('bolts', (k) => keys.includes(k));
    // The first group is the one the Wrench stage most likely means.
    if (!getValues('wrench.group')) setValue('wrench.group', key);
    append({
      key,
      name: '',
      part: bolt?.key ?? '',
      axis: [0, 1, 0],
      bolts: [],
      torque: { value: Number.NaN, unit: 'N·m', tolerancePct: 10 },
      passes: [0.5, 1],
      rule: 'cross',
    });
  };
  return (
    <Section
      id="fasteners"
      title="Fastener groups"
      intro="The Pattern stage uses the first group. Torque values come from the engine maker's service data."
    >
      {fields.map((field, index) => (
        <GroupEditor key={field.id} index={index} onRemove={() => remove(index)} />
      ))}
      <button type="button" className="btn-quiet" onClick={add}>
        Add a fastener group
      </button>
      <FieldIssue path="fastenerGroups" />
    </Section>
  );
}

function GroupEditor({ index, onRemove }: { index: number; onRemove: () => void }) {
  const { register, control, getValues, setValue } = useFormContext<EditorValues>();
  const parts = useWatch({ control, name: 'parts' });
  const group = useWatch({ control, name: `fastenerGroups.${index}` });
  const anchors = useWatch({ control, name: 'anchors' });
  const at = `fastenerGroups.${index}`;
  const preview = useMemo(() => tighteningPreview(group, anchors), [group, anchors]);
  const scene = useMemo(() => boltScene(parts, group, preview), [parts, group, preview]);
  const part = parts.find((p) => p.key === group.part);
  // A nut threads onto a shaft end (the flywheel nut); everything else goes into a threaded hole.
  const holes = anchorsOfParts(parts, part?.kind === 'nut' ? ['threaded-hole', 'shaft-end'] : ['threaded-hole']);
  const chosen = new Set(group.bolts.map((b) => b.anchor));
  const otherBoltKeys = getValues('fastenerGroups').flatMap((g, gi) => (gi === index ? [] : g.bolts.map((b) => b.key)));

  // The list's checkboxes and the 3D picker both change the bolts through this.
  const toggle = (anchorKey: string, on: boolean) => {
    // Bolts stay in the library's hole order, so hole 1 is listed first whatever order they were ticked in.
    const keep = holes.map((h) => h.anchor.key).filter((k) => (k === anchorKey ? on : chosen.has(k)));
    const taken = [...otherBoltKeys];
    const bolts = keep.map((anchor) => {
      const existing = group.bolts.find((b) => b.anchor === anchor);
      const key = existing?.key ?? boltKeyFor(anchor, taken);
      taken.push(key);
      return { key, anchor };
    });
    setValue(`fastenerGroups.${index}.bolts`, bolts, { shouldDirty: true });
    if (bolts[0]) setValue(`fastenerGroups.${index}.axis`, anchorAxis(bolts[0].anchor));
    setValue('anchors', withAnchors(getValues('anchors'), keep, getValues('parts')));
  };

  return (
    <fieldset className="space-y-4 rounded-lg border border-steel-200 p-4" aria-label={`Fastener group ${index + 1}`}>
      <div className="grid gap-3 sm:grid-cols-[2fr_2fr_auto] sm:items-end">
        <div>
          <label htmlFor={`${at}-name`} className="field-label">Group name</label>
          <input id={`${at}-name`} className="field-input" placeholder="e.g. Cover bolts" {...register(`fastenerGroups.${index}.name`)} {...useIssueProps(`${at}.name`)} />
        </div>
        <div>
          <label htmlFor={`${at}-part`} className="field-label">Fastener part</label>
          <select id={`${at}-part`} className="field-input" {...register(`fastenerGroups.${index}.part`)} {...useIssueProps(`${at}.part`)}>
            <option value="">Choose a part…</option>
            {parts
              .filter((p) => FASTENER_KINDS.includes(p.kind))
              .map((p) => (
                <option key={p.key} value={p.key}>
                  {p.name} ({p.count} in the kit)
                </option>
              ))}
          </select>
        </div>
        <button type="button" className="btn-quiet px-3" onClick={onRemove}>
          <span aria-hidden="true">✕</span> Remove group
        </button>
      </div>
      <FieldIssue path={`${at}.name`} />
      <FieldIssue path={`${at}.part`} />
      <FieldIssue path={`${at}.key`} />

      <fieldset>
        <legend className="field-label">Bolt positions</legend>
        {holes.length === 0 ? (
          <p className="text-sm text-steel-500">No part in the kit has threaded holes: add the part the bolts go into.</p>
        ) : (
          <ul className="grid gap-x-4 sm:grid-cols-2">
            {holes.map(({ anchor }) => (
              <li key={anchor.key}>
                <label className="flex min-h-touch items-center gap-2">
                  <input type="checkbox" className="h-5 w-5" checked={chosen.has(anchor.key)} onChange={(e) => toggle(anchor.key, e.target.checked)} />
                  {holeLabel(anchor)}
                </label>
              </li>
            ))}
          </ul>
        )}
        <FieldIssue path={`${at}.bolts`} />
        {group.bolts.map((_, bi) => (
          <div key={bi}>
            <FieldIssue path={`${at}.bolts.${bi}.anchor`} />
            <FieldIssue path={`${at}.bolts.${bi}.key`} />
          </div>
        ))}
        {holes.length > 0 && (
          <div className="mt-3">
            <BoltModelView index={index} groupName={group.name} scene={scene} onToggle={toggle} />
          </div>
        )}
      </fieldset>

      <div className="grid gap-3 sm:grid-cols-3">
        <div>
          <label htmlFor={`${at}-torque`} className="field-label">Torque spec</label>
          <input
            id={`${at}-torque`}
            type="number"
            step="any"
            min={0}
            className="field-input"
            {...register(`fastenerGroups.${index}.torque.value`, { valueAsNumber: true })}
            {...useIssueProps(`${at}.torque.value`)}
          />
          <FieldIssue path={`${at}.torque.value`} />
        </div>
        <div>
          <label htmlFor={`${at}-unit`} className="field-label">Unit</label>
          <select id={`${at}-unit`} className="field-input" {...register(`fastenerGroups.${index}.torque.unit`)}>
            {TORQUE_UNIT_IDS.map((u) => (
              <option key={u} value={u}>
                {u}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor={`${at}-tolerance`} className="field-label">Tolerance, ± %</label>
          <input
            id={`${at}-tolerance`}
            type="number"
            step="any"
            min={0}
            max={25}
            className="field-input"
            {...register(`fastenerGroups.${index}.torque.tolerancePct`, { valueAsNumber: true })}
            {...useIssueProps(`${at}.torque.tolerancePct`)}
          />
          <FieldIssue path={`${at}.torque.tolerancePct`} />
        </div>
      </div>

      <Controller
        control={control}
        name={`fastenerGroups.${index}.passes`}
        render={({ field }) => <PassesField path={`${at}.passes`} value={field.value} onChange={field.onChange} torque={group.torque} />}
      />

      <div>
        <label htmlFor={`${at}-rule`} className="field-label">Tightening rule</label>
        <select id={`${at}-rule`} className="field-input" {...register(`fastenerGroups.${index}.rule`)}>
          {PATTERN_RULES.map((r) => (
            <option key={r} value={r}>
              {r === 'cross' ? 'Cross (star) pattern, bolts on a circle' : 'Opposite, from the middle out'}
            </option>
          ))}
        </select>
        <p className="mt-1 text-sm text-steel-600">{RULE_DESCRIPTIONS[group.rule]}</p>
      </div>

      <BoltPreview index={index} axis={group.axis} preview={preview} />
    </fieldset>
  );
}
