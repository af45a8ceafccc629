import fc from "fast-check";

// Properties run with a fixed seed so CI is repeatable; set FC_SEED to explore other inputs.
fc.configureGlobal({ seed: Number(process.env.FC_SEED ?? 20261201) });
