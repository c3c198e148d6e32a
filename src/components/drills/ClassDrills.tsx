import { useState } from 'react';
import type { Stage } from '../../lib/procedure/schema';
import { toDateTimeLocal } from '../../lib/local-time';
import { createDrill, listDrills, updateDrill, type ClassDrillView } from './drill-api';
import { DrillForm, drillFields, type DrillFormValues, type ProcedureChoice } from './DrillForm';
import { DrillRow } from './DrillRow';

// The Drills section of a class page, for its instructors: assign a drill, see where the class stands on
// each, edit or close one. Everything goes through the JSON API; the list is read back after each change.

interface Props {
  classId: string;
  procedures: ProcedureChoice[];
  drills: ClassDrillView[];
}

const DEFAULT_PASS_MARK = '80';

export default function ClassDrills({ classId, procedures, drills: initial }: Props) {
  const [drills, setDrills] = useState(initial);
  const [editing, setEditing] = useState<string | null>(null);
  const first = procedures[0];

  const refresh = async (changed?: ClassDrillView) => {
    const list = await listDrills(classId);
    if (list) setDrills(list);
    else if (changed) setDrills((d) => [...d.filter((x) => x.id !== changed.id), changed]);
  };

  const blank: DrillFormValues = {
    procedure: first?.slug ?? '',
    stages: first ? [...first.stages] : [],
    due: '',
    passMark: DEFAULT_PASS_MARK,
    attemptLimit: '',
    answersAfterDue: false,
  };

  return (
    <div className="grid gap-6">
      <section className="panel" aria-labelledby="assign-heading">
        <h2 id="assign-heading" className="mb-4 text-xl font-bold">
          Assign a drill
        </h2>
        {procedures.length === 0 ? (
          <p className="text-steel-600">No procedures are published yet.</p>
        ) : (
          <DrillForm
            label="Assign a drill"
            procedures={procedures}
            initial={blank}
            submitLabel="Assign drill"
            onSave={async (values, dueAt) => {
              const saved = await createDrill(classId, { procedure: values.procedure, ...drillFields(values, dueAt) });
              if (saved.ok) await refresh(saved.drill);
              return saved;
            }}
          />
        )}
      </section>

      <section className="panel" aria-labelledby="drills-heading">
        <h2 id="drills-heading" className="mb-4 text-xl font-bold">
          Drills ({drills.length})
        </h2>
        {drills.length === 0 ? (
          <p className="text-steel-600">No drills yet. Assign one above; each learner of the class gets an e-mail.</p>
        ) : (
          <ul className="divide-y divide-steel-100" data-testid="class-drills">
            {drills.map((drill) => (
              <li key={drill.id} className="py-4" data-drill-id={drill.id}>
                <DrillRow drill={drill} onEdit={() => setEditing(drill.id)} onChanged={refresh} />
                {editing === drill.id && (
                  <div className="mt-4 rounded-lg border border-steel-200 bg-steel-50 p-4">
                    <DrillForm
                      label={`Edit drill: ${drill.procedure.title}`}
                      offeredStages={offeredStages(procedures, drill)}
                      initial={editValues(drill)}
                      submitLabel="Save changes"
                      onCancel={() => setEditing(null)}
                      onSave={async (values, dueAt) => {
                        // An unchanged due date is left out: it may have passed, and that is fine for an edit.
                        const unchanged = values.due === toDateTimeLocal(new Date(drill.dueAt));
                        const { dueAt: _due, ...rest } = drillFields(values, dueAt);
                        const saved = await updateDrill(drill.id, unchanged ? rest : { ...rest, dueAt });
                        if (saved.ok) {
                          setEditing(null);
                          await refresh(saved.drill);
                        }
                        return saved;
                      }}
                    />
                  </div>
                )}
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}

function editValues(drill: ClassDrillView): DrillFormValues {
  return {
    procedure: drill.procedure.slug,
    stages: drill.stages,
    due: toDateTimeLocal(new Date(drill.dueAt)),
    passMark: String(drill.passMarkPct),
    attemptLimit: drill.attemptLimit === null ? '' : String(drill.attemptLimit),
    answersAfterDue: drill.answersAfterDue,
  };
}

/** The stages the drill's procedure offers: from the catalogue when it is the same version, else the drill's own. */
function offeredStages(procedures: ProcedureChoice[], drill: ClassDrillView): Stage[] {
  const same = procedures.find((p) => p.slug === drill.procedure.slug && p.version === drill.procedure.version);
  return same?.stages ?? drill.stages;
}
