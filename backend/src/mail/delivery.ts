/** How the outbox turns its rows into mail and hands them to SMTP; one place for every composed kind. */
import type { Config } from '../config.js';
import { baseUrl } from '../http/base-url.js';
import { ADDRESS_CONFIRMATION_MAIL, composeAddressConfirmationMail, composePasswordResetMail, PASSWORD_RESET_MAIL } from '../services/account.service.js';
import type { Mailer } from './mailer.js';
import type { OutboxDelivery } from './outbox.js';

export function mailDelivery(config: Config, transport: Mailer): OutboxDelivery {
  return {
    transport,
    // The base address is read at delivery, from the configuration only (never from a request).
    composers: {
      [PASSWORD_RESET_MAIL]: (ds, email) => composePasswordResetMail(ds, email, baseUrl(config)),
      [ADDRESS_CONFIRMATION_MAIL]: (ds, email) => composeAddressConfirmationMail(ds, email, baseUrl(config)),
    },
  };
}
