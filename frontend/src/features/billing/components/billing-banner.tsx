import { Link } from 'react-router-dom';
import { formatDayOfMoment } from '@shared/text/display-format';
import { useBillingNotice } from '../api/get-billing-notice';

/** For every member: the organisation is read-only (and why), holds more than its plan allows, or its trial is in its last days. */
export function BillingBanner({ organisationId, canManage }: { organisationId: string | null | undefined; canManage: boolean }) {
  const { data } = useBillingNotice(organisationId);
  if (!data) return null;
  const where = canManage ? (
    <Link to="/settings/billing" className="font-medium underline">
      Choose a plan
    </Link>
  ) : (
    <span>An administrator can choose a plan.</span>
  );
  if (data.readOnly) {
    return (
      <div role="alert" className="mb-4 rounded border border-warn/40 bg-ledger-50 px-3 py-2 text-sm text-warn" data-testid="billing-banner">
        {data.readOnly} {where}
      </div>
    );
  }
  if (data.overLimit) {
    return (
      <div role="alert" className="mb-4 rounded border border-warn/40 bg-ledger-50 px-3 py-2 text-sm text-warn" data-testid="billing-banner">
        {data.overLimit}{' '}
        {canManage ? (
          <Link to="/settings/billing" className="font-medium underline">
            Billing
          </Link>
        ) : (
          <span>An administrator can change the plan.</span>
        )}
      </div>
    );
  }
  if (data.trialEndingSoon && data.trialDaysLeft !== null) {
    return (
      <div role="status" className="mb-4 rounded border border-ledger-100 bg-ledger-50 px-3 py-2 text-sm text-ledger-700" data-testid="billing-banner">
        The trial ends in {data.trialDaysLeft} {data.trialDaysLeft === 1 ? 'day' : 'days'} ({formatDayOfMoment(data.trialEndsAt, 'UTC')}). After that the
        organisation can be read but not changed until a plan is chosen. {where}
      </div>
    );
  }
  return null;
}
