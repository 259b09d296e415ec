#!/usr/bin/env node
// `npm run --silent evaluate`: reads one JSON request, or an array of them, from standard
// input and prints one JSON result per request (an array for an array). Nothing else goes to
// standard output; a malformed input is reported on standard error with exit code 2.
import { RequestEvaluator } from '@sixtyfold/shared';

const chunks = [];
for await (const chunk of process.stdin) chunks.push(chunk);
const text = Buffer.concat(chunks).toString('utf8');

let input;
try {
  input = JSON.parse(text);
} catch (err) {
  process.stderr.write(`evaluate: standard input is not JSON (${err.message})\n`);
  process.exit(2);
}

const evaluator = new RequestEvaluator();
const output = Array.isArray(input) ? input.map((request) => evaluator.evaluate(request)) : evaluator.evaluate(input);
process.stdout.write(`${JSON.stringify(output, null, Array.isArray(input) ? 0 : 2)}\n`);
