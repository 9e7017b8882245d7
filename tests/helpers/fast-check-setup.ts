import fc from 'fast-check';

// Property tests run with a fixed seed so CI is repeatable; FC_RANDOM=1 explores new seeds locally.
if (!process.env.FC_RANDOM) fc.configureGlobal({ seed: 20261202 });
