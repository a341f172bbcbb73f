import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { BillingOverview, BillingPlanOffer } from '@shared/schemas/billing';
import { formatCurrency, formatDayOfMoment } from '@shared/text/display-format';
import { Button } from '@frontend/components/ui/button';
import { ConfirmAction } from '@frontend/components/ui/confirm-action';
import { Notice } from '@frontend/components/ui/notice';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { useBilling } from '../api/get-billing';
import { useChangeSubscription } from '../api/change-subscription';
import { useOpenStripePage } from '../api/open-stripe-page';
import { UsageBars } from './usage-bars';

const day = (iso: string | null) => formatDayOfMoment(iso, 'UTC');
const money = (amount: string, currency: string) => formatCurrency(Number(amount), currency.toUpperCase(), 2);

const STATUS_WORDS: Record<BillingOverview['status'], string> = {
  trialing: 'Trial',
  active: 'Paid and running',
  past_due: 'Payment overdue',
  canceled: 'Ended',
  unpaid: 'Unpaid',
};

const LIVE: BillingOverview['status'][] = ['active', 'past_due'];

function limitsText(o: BillingPlanOffer): string {
  const { units, clientGroups, seats } = o.limits;
  return [`up to ${units} units`, `${clientGroups} client groups`, seats ? `${seats} client-limited members` : 'no client-limited members'].join(', ');
}

export function BillingPage({ organisationId }: { organisationId: string }) {
  const [params] = useSearchParams();
  const justPaid = params.get('checkout') === 'done';
  const query = useBilling(organisationId, justPaid);
  const [interval, setInterval] = useState<'month' | 'year'>('month');
  const open = useOpenStripePage();
  const change = useChangeSubscription(organisationId);
  const waitingForStripe = justPaid && query.data && !LIVE.includes(query.data.status);

  if (query.isPending) return <LoadingState what="billing" />;
  if (query.isError) return <ErrorState what="billing" error={query.error} onRetry={() => void query.refetch()} />;
  const b = query.data;
  const live = LIVE.includes(b.status);
  const offers = b.plans.filter((p) => p.interval === interval);
  const problem = (open.error ?? change.error) as Error | null;

  return (
    <section className="flex flex-col gap-6">
      <div>
        <h1>Billing</h1>
        <p className="mt-1 text-sm text-ink-soft">The organisation's plan, what it uses of it, and its invoices. Payments are handled by Stripe.</p>
      </div>
      {waitingForStripe && <Notice>Stripe has the payment; the new plan shows here as soon as Stripe confirms it.</Notice>}
      {b.readOnly && <Notice tone="warn">{b.readOnly}</Notice>}
      {problem && <Notice tone="fault">{problem.message}</Notice>}

      <dl className="grid grid-cols-1 gap-x-8 gap-y-2 text-sm sm:grid-cols-2" aria-label="Subscription">
        <div>
          <dt className="text-ink-faint">Plan</dt>
          <dd className="text-base font-medium" data-testid="billing-plan">
            {b.plan.name}
            {b.interval ? `, billed every ${b.interval}` : ''}
          </dd>
        </div>
        <div>
          <dt className="text-ink-faint">Status</dt>
          <dd data-testid="billing-status">
            {STATUS_WORDS[b.status]} <span className="text-ink-faint">({b.status})</span>
          </dd>
        </div>
        {b.trialDaysLeft !== null && (
          <div>
            <dt className="text-ink-faint">Trial</dt>
            <dd>
              {b.trialDaysLeft} {b.trialDaysLeft === 1 ? 'day' : 'days'} left (ends {day(b.trialEndsAt)})
            </dd>
          </div>
        )}
        <div>
          <dt className="text-ink-faint">Next invoice</dt>
          <dd data-testid="billing-next-invoice">
            {b.nextInvoice
              ? `${money(b.nextInvoice.amount, b.nextInvoice.currency)} on ${day(b.nextInvoice.date)}`
              : b.cancelAtPeriodEnd
                ? `None: the subscription ends on ${day(b.currentPeriodEnd)}`
                : 'None'}
          </dd>
        </div>
      </dl>

      <div>
        <h2 className="mb-2">Use of the plan</h2>
        {b.overLimit.length > 0 && (
          <div className="mb-3 flex flex-col gap-2" data-testid="billing-over-limit">
            {b.overLimit.map((o) => (
              <Notice key={o.limit} tone="warn">
                {o.message}
              </Notice>
            ))}
          </div>
        )}
        {b.openCheckout && (
          <p className="mb-3 text-sm text-ink-soft" data-testid="billing-open-checkout">
            A checkout for the {b.openCheckout.name} plan is open until {formatDayOfMoment(b.openCheckout.until, 'UTC')}, or until it is paid: until then the
            organisation can hold no more than that plan allows.
          </p>
        )}
        <UsageBars usage={b.usage} />
      </div>

      <div>
        <div className="mb-2 flex flex-wrap items-center gap-4">
          <h2>{live ? 'Change plan' : 'Choose a plan'}</h2>
          <fieldset className="flex gap-3 text-sm">
            <legend className="sr-only">Billed</legend>
            {(['month', 'year'] as const).map((i) => (
              <label key={i} className="flex items-center gap-1">
                <input type="radio" name="interval" value={i} checked={interval === i} onChange={() => setInterval(i)} />
                {i === 'month' ? 'Monthly' : 'Yearly'}
              </label>
            ))}
          </fieldset>
        </div>
        <ul className="grid grid-cols-1 gap-3 md:grid-cols-2">
          {offers.map((o) => {
            const current = b.price === o.price && live;
            return (
              <li key={o.price} className="flex flex-col gap-2 rounded border border-rule bg-paper-raised p-3" aria-label={`${o.name} plan`}>
                <div className="flex items-baseline justify-between gap-2">
                  <span className="font-medium">{o.name}</span>
                  <span className="tabular-nums">
                    {money(o.amount, o.currency)} a {o.interval}
                  </span>
                </div>
                <p className="text-sm text-ink-soft">{limitsText(o)}</p>
                {current ? (
                  <span className="text-sm font-medium text-tube-700">Current plan</span>
                ) : live ? (
                  <Button variant="quiet" disabled={change.isPending} onClick={() => change.mutate({ kind: 'change', price: o.price })}>
                    Move to {o.name}
                  </Button>
                ) : (
                  <Button disabled={open.isPending} onClick={() => open.mutate({ page: 'checkout', price: o.price })}>
                    Subscribe to {o.name}
                  </Button>
                )}
              </li>
            );
          })}
        </ul>
      </div>

      {live && (
        <div className="flex flex-wrap items-center gap-3">
          {b.cancelAtPeriodEnd ? (
            <Button variant="quiet" disabled={change.isPending} onClick={() => change.mutate({ kind: 'resume' })}>
              Keep the subscription
            </Button>
          ) : (
            <ConfirmAction
              label="End the subscription"
              question={`The subscription ends on ${day(b.currentPeriodEnd)}. After that the organisation is read-only until a plan is chosen again; nothing is deleted.`}
              confirmLabel="End it at the period end"
              pending={change.isPending}
              onConfirm={() => change.mutate({ kind: 'cancel' })}
            />
          )}
          <Button variant="quiet" disabled={open.isPending} onClick={() => open.mutate({ page: 'portal' })}>
            Card and invoices at Stripe
          </Button>
        </div>
      )}

      <div>
        <h2 className="mb-2">Invoices</h2>
        {b.invoices.length === 0 ? (
          <p className="text-sm text-ink-soft">No invoices yet.</p>
        ) : (
          <table className="w-full text-sm">
            <thead>
              <tr className="text-left text-ink-faint">
                <th className="py-1 font-normal">Invoice</th>
                <th className="py-1 font-normal">Date</th>
                <th className="py-1 text-right font-normal">Amount</th>
                <th className="py-1 font-normal">Status</th>
              </tr>
            </thead>
            <tbody>
              {b.invoices.map((i) => (
                <tr key={i.id} className="border-t border-rule">
                  <td className="py-1">{i.url ? <a href={i.url}>{i.number ?? i.id}</a> : (i.number ?? i.id)}</td>
                  <td className="py-1">{day(i.date)}</td>
                  <td className="py-1 text-right tabular-nums">{money(i.amount, i.currency)}</td>
                  <td className="py-1">{i.status}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </div>
    </section>
  );
}
