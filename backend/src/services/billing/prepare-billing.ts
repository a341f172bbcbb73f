/**
 * At start: our products and prices in Stripe (made when missing, read back), and with the local stand-in the
 * app's webhook address registered with it (with real Stripe the endpoint is set up once in Stripe's dashboard,
 * its signing secret given as STRIPE_WEBHOOK_SECRET). Trial-ending mail is looked for every hour.
 */
import type { DataSource } from 'typeorm';
import { publicUrl, type Config } from '../../config.js';
import type { BillingContext } from './billing-context.js';
import { HANDLED_EVENTS } from './receive-webhook.js';
import { usesLocalStripe } from './stripe-client.js';
import { sendTrialEndingMails } from './trial-ending-mails.js';
import { everySoOften } from '../../jobs/every-so-often.js';

export async function prepareBilling(ctx: BillingContext, log: (line: string) => void): Promise<void> {
  try {
    const catalogue = await ctx.catalogue();
    log(`Stripe prices ready: ${[...catalogue.keys()].join(', ')}`);
    if (usesLocalStripe(ctx.config)) {
      const url = `${publicUrl(ctx.config).replace(/\/$/, '')}/api/billing/webhook`;
      await ctx.stripe.webhookEndpoints.create({ url, enabled_events: [...HANDLED_EVENTS] });
      log(`Stripe stand-in delivers events to ${url}`);
    }
  } catch (err) {
    // Billing pages say so and retry; the rest of the product works without Stripe.
    log(`Stripe is not ready (${err instanceof Error ? err.message : String(err)}): billing tries again on first use`);
  }
}

export function startTrialEndingMails(ds: DataSource, config: Config, log: (line: string) => void): { stop: () => void } {
  return everySoOften(() => sendTrialEndingMails(ds, config), 'trial-ending mail', log, 60 * 60 * 1000, 5_000);
}
