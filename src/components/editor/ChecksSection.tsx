import { Controller, useFormContext, useWatch } from 'react-hook-form';
import { LENGTH_UNIT_IDS, TORQUE_UNIT_IDS } from '../../lib/procedure/schema';
import type { EditorValues } from '../../lib/editor/values';
import { FieldIssue, useIssueProps } from './FieldIssue';
import { Section } from './Section';

// The Wrench stage's task (the wrench on the bench and the unit its dial reads) and the Final check's
// counts. Each appears while its stage is chosen.

export function ChecksSection() {
  const { control } = useFormContext<EditorValues>();
  const hasWrench = useWatch({ control, name: 'hasWrench' });
  const hasFinalCheck = useWatch({ control, name: 'hasFinalCheck' });
  if (!hasWrench && !hasFinalCheck) return null;
  return (
    <Section id="checks" title="Wrench and final check">
      {hasWrench && <WrenchFields />}
      {hasFinalCheck && <FinalCheckFields />}
    </Section>
  );
}

function WrenchFields() {
  const { register, control } = useFormContext<EditorValues>();
  const groups = useWatch({ control, name: 'fastenerGroups' });
  const issueProps = useIssueProps('wrench.group');
  return (
    <fieldset className="space-y-3" aria-label="Wrench task">
      <legend className="text-lg font-bold">Wrench</legend>
      <div className="grid gap-3 sm:grid-cols-3">
        <div>
          <label htmlFor="wrench-group" className="field-label">Spec from group</label>
          {/* Controlled: the group may be chosen for the instructor before its option exists. */}
          <Controller
            control={control}
            name="wrench.group"
            render={({ field }) => (
              <select id="wrench-group" className="field-input" {...field} {...issueProps}>
                <option value="">Choose a group…</option>
                {groups.map((g) => (
                  <option key={g.key} value={g.key}>
                    {g.name || g.key}
                  </option>
                ))}
              </select>
            )}
          />
          <FieldIssue path="wrench.group" />
        </div>
        <Select id="wrench-dial" label="Wrench dial reads" name="wrench.dialUnit" options={TORQUE_UNIT_IDS} />
        <Select id="wrench-shown" label="Spec shown to the learner in" name="wrench.specShownIn" options={TORQUE_UNIT_IDS} />
        <NumberInput id="wrench-length" label="Wrench length" name="wrench.wrenchLength" />
        <NumberInput id="wrench-extension" label="Extension or adapter" name="wrench.extension" />
        <Select id="wrench-length-unit" label="Length unit" name="wrench.lengthUnit" options={LENGTH_UNIT_IDS} />
      </div>
      <fieldset>
        <legend className="field-label">Extension points</legend>
        <div className="flex flex-wrap gap-4">
          <label className="flex min-h-touch items-center gap-2">
            <input type="radio" value="forward" {...register('wrench.direction')} /> Away from the handle (lengthens the lever)
          </label>
          <label className="flex min-h-touch items-center gap-2">
            <input type="radio" value="back" {...register('wrench.direction')} /> Back toward the handle (shortens it)
          </label>
        </div>
      </fieldset>
    </fieldset>
  );
}

function FinalCheckFields() {
  const { control, setValue } = useFormContext<EditorValues>();
  const groups = useWatch({ control, name: 'fastenerGroups' });
  const bolts = groups.reduce((n, g) => n + g.bolts.length, 0);
  return (
    <fieldset className="space-y-3" aria-label="Final check">
      <legend className="text-lg font-bold">Final check</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <NumberInput id="final-count" label="Fasteners installed" name="finalCheck.fastenerCount" />
          <button type="button" className="btn-quiet mt-2 text-sm" onClick={() => setValue('finalCheck.fastenerCount', bolts, { shouldDirty: true })}>
            Use the bolt count ({bolts})
          </button>
        </div>
        <NumberInput id="final-turns" label="Crankshaft turns without binding" name="finalCheck.crankTurns" />
      </div>
    </fieldset>
  );
}

type NumberPath = 'wrench.wrenchLength' | 'wrench.extension' | 'finalCheck.fastenerCount' | 'finalCheck.crankTurns';
type SelectPath = 'wrench.dialUnit' | 'wrench.specShownIn' | 'wrench.lengthUnit';

function NumberInput({ id, label, name }: { id: string; label: string; name: NumberPath }) {
  const { register } = useFormContext<EditorValues>();
  return (
    <div>
      <label htmlFor={id} className="field-label">{label}</label>
      <input id={id} type="number" step="any" min={0} className="field-input" {...register(name, { valueAsNumber: true })} {...useIssueProps(name)} />
      <FieldIssue path={name} />
    </div>
  );
}

function Select({ id, label, name, options }: { id: string; label: string; name: SelectPath; options: readonly string[] }) {
  const { register } = useFormContext<EditorValues>();
  return (
    <div>
      <label htmlFor={id} className="field-label">{label}</label>
      <select id={id} className="field-input" {...register(name)}>
        {options.map((o) => (
          <option key={o} value={o}>
            {o}
          </option>
        ))}
      </select>
    </div>
  );
}
