import { useMemo, useState } from 'react';
import { planPressureUnit } from '../../lib/reduction/browser';
import { TEST_PRESSURE_RULES, type TestPressureRuleId } from '../../lib/test-pressure';
import TestPressureHelper from '../review/TestPressureHelper';
import { PlanNumberField, PlanSelectField, PlanTextField } from './PlanField';
import PlanSection from './PlanSection';
import { cleanFloat } from './plan-draft';
import { buildPlanPreview } from './plan-preview';
import { MODEL_NAME } from '../../lib/verdict-words';
import { usePlanEditor } from './plan-editor-context';

const MODELS = [
  { value: 'lame', label: `${MODEL_NAME.lame}, outer surface (default)` },
  { value: 'membrane', label: `${MODEL_NAME.membrane}, mean radius (hand calculation)` },
];

/** Model, test pressure (with the code-rule helper beside it) and the log's pressure and time columns. */
export default function TestConditionsSection() {
  const { plan, units, readOnly, setField } = usePlanEditor();
  const pressure = planPressureUnit(units);
  const [rule, setRule] = useState<{ id: TestPressureRuleId; value: number } | null>(null);
  const ruleLabel = rule && TEST_PRESSURE_RULES.find((r) => r.id === rule.id)?.label;
  const ruleStillUsed = rule && plan.testPressure === rule.value;
  // the engine's yield check for the plan as typed; stress is linear in pressure, so it scales
  const preview = useMemo(() => buildPlanPreview(plan), [plan]);
  const tolerances = plan.tolerances as { yieldFraction?: unknown } | undefined;
  const yieldLimit = typeof tolerances?.yieldFraction === 'number' ? tolerances.yieldFraction : 0.9;
  const yieldFractionAt = (p: number) =>
    preview && preview.testPressure > 0
      ? (preview.predicted[preview.model].yieldCheck.fraction * p) / preview.testPressure
      : null;
  return (
    <div className="grid gap-5 2xl:grid-cols-2">
      <PlanSection id="plan-conditions" title="Model, test pressure and log columns">
        <div className="grid gap-4">
          <PlanSelectField
            path={['model']}
            label="Prediction model used for the comparison"
            options={MODELS}
            defaultValue="lame"
            hint="Both are always shown below. The membrane formula over-predicts at the outer surface by about (mean radius / inside radius)²."
          />
          <PlanNumberField
            path={['testPressure']}
            label="Test pressure"
            unit={pressure}
            hint={
              ruleStillUsed ? (
                <>
                  From <strong>{ruleLabel}</strong>. The governing code edition and the jurisdiction decide; confirm it.
                </>
              ) : (
                'The pressure of the highest hold, from the test procedure.'
              )
            }
          />
          <div className="grid gap-4 sm:grid-cols-2">
            <PlanTextField
              path={['columns', 'pressure']}
              label="Pressure column in the log"
              hint="Header text exactly; a unit in brackets such as [bar] is converted, in parentheses (bar) too, and an absolute unit such as bar(a) or psia to gauge pressure."
            />
            <PlanTextField
              path={['columns', 'time']}
              label="Time column (optional)"
              optional
              hint="Seconds or ISO 8601 timestamps."
            />
          </div>
        </div>
      </PlanSection>
      {!readOnly && (
        <TestPressureHelper
          key={units}
          pressureUnit={pressure}
          yieldFractionAt={yieldFractionAt}
          yieldLimit={yieldLimit}
          onPick={(value, id) => {
            const v = cleanFloat(value);
            setRule({ id, value: v });
            setField(['testPressure'], v);
          }}
        />
      )}
    </div>
  );
}
