import type { Request, Response } from 'express';
import type { DataSource } from 'typeorm';
import {
  addressConfirmation,
  createOrganisationRequest,
  passwordChange,
  passwordResetConfirm,
  passwordResetRequest,
  profileUpdate,
  signUpRequest,
} from '@shared/schemas/accounts.js';
import { establishSession } from '../auth/establish-session.js';
import type { Config } from '../config.js';
import { baseUrl } from '../http/base-url.js';
import { addressConfirmLimiter, passwordChangeLimiter, resetConfirmLimiter, resetLimiter, signUpLimiter } from '../http/rate-limits.js';
import type { RouteSpec } from '../http/route-registry.js';
import type { Mailer } from '../mail/mailer.js';
import {
  changePassword,
  confirmAddress,
  confirmPasswordReset,
  createOrganisation,
  requestPasswordReset,
  SIGN_UP_ANSWER,
  signUp,
  updateProfile,
} from '../services/account.service.js';
import { sessionResponse } from '@shared/schemas/session.js';
import { messageResponse } from '@shared/schemas/errors.js';

export function accountRoutes(ds: DataSource, mailer: Mailer, config: Config, answerSession: (req: Request, res: Response) => Promise<void>): RouteSpec[] {
  return [
    {
      method: 'post',
      path: '/api/sign-up',
      response: messageResponse,
      status: 201,
      access: 'public',
      tenantScoped: false,
      rateLimit: signUpLimiter(ds),
      body: signUpRequest,
      description: 'Create an account and a new organisation on a free trial (same answer whether or not the address has an account; then sign in)',
      handler: async (req, res) => {
        await signUp(ds, mailer, req.body, baseUrl(config));
        res.status(201).json(SIGN_UP_ANSWER);
      },
    },
    {
      method: 'post',
      path: '/api/organisations',
      response: sessionResponse,
      status: 201,
      access: 'signed-in',
      tenantScoped: false,
      body: createOrganisationRequest,
      description: 'Start another organisation (trial) with yourself as administrator, and switch to it',
      handler: async (req, res) => {
        const organisation = await createOrganisation(ds, req.actor!.user.id, req.body.name);
        req.session.activeOrganisationId = organisation.id;
        res.status(201);
        await answerSession(req, res);
      },
    },
    {
      method: 'patch',
      path: '/api/profile',
      response: sessionResponse,
      access: 'signed-in',
      tenantScoped: false,
      body: profileUpdate,
      description: 'Change your name or unit preference (US customary or SI)',
      handler: async (req, res) => {
        await updateProfile(ds, req.actor!.user, req.body);
        await answerSession(req, res);
      },
    },
    {
      method: 'post',
      path: '/api/profile/password',
      response: sessionResponse,
      access: 'signed-in',
      tenantScoped: false,
      rateLimit: passwordChangeLimiter(ds),
      body: passwordChange,
      description: 'Change your password; every other session ends, this one gets a new id, your API tokens are revoked',
      handler: async (req, res) => {
        const user = req.actor!.user;
        const active = req.session.activeOrganisationId;
        await changePassword(ds, user, req.body);
        await establishSession(req, user, active);
        await answerSession(req, res);
      },
    },
    {
      method: 'post',
      path: '/api/password-reset',
      response: messageResponse,
      status: 202,
      access: 'public',
      tenantScoped: false,
      rateLimit: resetLimiter(ds),
      body: passwordResetRequest,
      description: 'E-mail a password reset link (same answer, in the same time, whether or not the account exists)',
      handler: async (req, res) => {
        await requestPasswordReset(ds, req.body.email);
        res.status(202).json({ message: 'If an account uses this e-mail, a reset link is on its way.' });
      },
    },
    {
      method: 'post',
      path: '/api/password-reset/confirm',
      response: 'empty',
      access: 'public',
      tenantScoped: false,
      rateLimit: resetConfirmLimiter(ds),
      body: passwordResetConfirm,
      description: 'Set a new password with a reset link; every session of the account ends',
      handler: async (req, res) => {
        await confirmPasswordReset(ds, req.body.token, req.body.password);
        res.status(204).end();
      },
    },
    {
      method: 'post',
      path: '/api/address-confirmations',
      response: 'empty',
      access: 'public',
      tenantScoped: false,
      rateLimit: addressConfirmLimiter(ds),
      body: addressConfirmation,
      description: 'Confirm your e-mail address with the link mailed after sign-up (opens the local mailbox in a local run)',
      handler: async (req, res) => {
        await confirmAddress(ds, req.body.token);
        res.status(204).end();
      },
    },
  ];
}
