// Local Stripe API fake (stripe-stateful-mock), bound to loopback only. Usage: node stripe-fake.cjs <port>
/* eslint-disable @typescript-eslint/no-require-imports -- plain CommonJS entry forked as its own process */
const { createExpressApp } = require('stripe-stateful-mock');
const port = Number(process.argv[2] || 12111);
const server = createExpressApp().listen(port, '127.0.0.1', () => {
  process.stdout.write(`stripe-fake listening on ${port}\n`);
});
const stop = () => server.close(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
// Exit with the parent: never outlive the process that started us.
process.on('disconnect', stop);
