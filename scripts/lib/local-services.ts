/**
 * The hosted services' local stand-ins, each on loopback: Stripe (stripe-stateful-mock, own process),
 * Google sign-in (oauth2-mock-server). The SMTP sink is started by the app itself (backend/src/mail/smtp-sink.ts).
 * Each one starts only when the environment does not point at the real service.
 */
import { fork, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { OAuth2Server } from 'oauth2-mock-server';

export interface GoogleFake {
  issuer: string;
  authUrl: string;
  tokenUrl: string;
  userInfoUrl: string;
  /** The identity the next sign-in will return. */
  setNextUser: (user: { sub: string; email: string; name: string }) => void;
  stop: () => Promise<void>;
}

export async function startGoogleFake(port: number): Promise<GoogleFake> {
  const server = new OAuth2Server();
  await server.issuer.keys.generate('RS256');
  let nextUser = { sub: 'google-demo-0001', email: 'google.user@example.test', name: 'Google Demo User' };
  server.service.on('beforeUserinfo', (response: { body: unknown; statusCode: number }) => {
    response.body = { sub: nextUser.sub, email: nextUser.email, email_verified: true, name: nextUser.name };
    response.statusCode = 200;
  });
  server.service.on('beforeTokenSigning', (token: { payload: Record<string, unknown> }) => {
    token.payload.sub = nextUser.sub;
    token.payload.email = nextUser.email;
  });
  await server.start(port, '127.0.0.1');
  const address = server.address();
  const issuer = `http://127.0.0.1:${address.port}`;
  server.issuer.url = issuer;
  return {
    issuer,
    authUrl: `${issuer}/authorize`,
    tokenUrl: `${issuer}/token`,
    userInfoUrl: `${issuer}/userinfo`,
    setNextUser: (u) => {
      nextUser = u;
    },
    stop: () => server.stop(),
  };
}

export interface StripeFake {
  apiBase: string;
  stop: () => Promise<void>;
}

function waitForPort(port: number, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  return new Promise((resolve, reject) => {
    const attempt = () => {
      const socket = net.connect(port, '127.0.0.1');
      socket.once('connect', () => {
        socket.destroy();
        resolve();
      });
      socket.once('error', () => {
        socket.destroy();
        if (Date.now() > deadline) reject(new Error(`nothing listens on 127.0.0.1:${port} after ${timeoutMs} ms`));
        else setTimeout(attempt, 100);
      });
    };
    attempt();
  });
}

/** The fake signs the events it delivers with `webhookSecret` (the app's STRIPE_WEBHOOK_SECRET). */
export async function startStripeFake(port: number, webhookSecret = 'whsec_cleancase_local'): Promise<StripeFake> {
  const child: ChildProcess = fork(path.join(import.meta.dirname, '..', 'fakes', 'stripe-fake.cjs'), [String(port), webhookSecret], {
    stdio: ['ignore', 'ignore', 'inherit', 'ipc'],
  });
  let exited = false;
  child.on('exit', () => {
    exited = true;
  });
  await waitForPort(port, 15_000);
  return {
    apiBase: `http://127.0.0.1:${port}`,
    stop: async () => {
      if (exited) return;
      child.kill('SIGTERM');
      for (let i = 0; i < 50 && !exited; i++) await new Promise((r) => setTimeout(r, 100));
      if (!exited) child.kill('SIGKILL');
    },
  };
}
