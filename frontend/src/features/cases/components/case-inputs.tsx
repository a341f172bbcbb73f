import { DriverInputs } from './driver-inputs';
import { EconomicsInputs } from './economics-inputs';
import { FoulingInputs } from './fouling-inputs';
import type { InputGroupProps } from './input-group';
import { MethodInputs } from './method-inputs';
import { OutageInputs } from './outage-inputs';
import { UncertaintyInputs } from './uncertainty-inputs';

/** The case's inputs in the order a person reasons about them. */
export function CaseInputs(props: InputGroupProps) {
  return (
    <div className="flex flex-col gap-3">
      <FoulingInputs {...props} />
      <DriverInputs {...props} />
      <MethodInputs {...props} />
      <OutageInputs {...props} />
      <EconomicsInputs {...props} />
      <UncertaintyInputs {...props} />
    </div>
  );
}
