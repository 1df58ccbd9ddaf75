import { PlanNumberField, PlanTextField } from './PlanField';
import PlanSection from './PlanSection';
import { usePlanEditor } from './plan-editor-context';

/**
 * How the test is conducted: the written procedure, the governing code, the medium, the metal
 * temperature and the witness. Not inputs of the reduction; the report and both signed statements
 * print them, so the signer attests the test was run under them.
 */
export default function TestConductSection() {
  const { units } = usePlanEditor();
  return (
    <PlanSection
      id="plan-procedure"
      title="Test conduct"
      intro="Printed on the report and in the signed statements. The written procedure and the governing code set the test pressure, the holds and the exclusion zone; this record does not replace them."
    >
      <div className="grid gap-4 sm:grid-cols-2">
        <PlanTextField
          path={['procedure', 'reference']}
          label="Written test procedure (optional)"
          optional
          placeholder="e.g. procedure number and revision"
          hint="The document the test follows, with its revision."
        />
        <PlanTextField
          path={['procedure', 'codeEdition']}
          label="Governing code and edition (optional)"
          optional
          hint="The code, its edition and any addenda the test pressure comes from."
        />
        <PlanTextField
          path={['procedure', 'testMedium']}
          label="Test medium (optional)"
          optional
          placeholder="e.g. water"
          hint="A gas in place of a liquid needs the governing code’s pneumatic rules and their precautions."
        />
        <PlanNumberField
          path={['procedure', 'testTemperature']}
          label="Metal temperature during the test (optional)"
          unit={units === 'US' ? '°F' : '°C'}
          hint="Keep it above the minimum the code or the vessel’s documents set against brittle fracture."
        />
        <PlanTextField
          path={['procedure', 'witness']}
          label="Witness (optional)"
          optional
          className="sm:col-span-2"
          hint="The authorised inspector or other witness, by name and organisation."
        />
      </div>
    </PlanSection>
  );
}
