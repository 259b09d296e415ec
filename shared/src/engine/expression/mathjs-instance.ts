import {
  absDependencies,
  acosDependencies,
  acoshDependencies,
  addDependencies,
  asinDependencies,
  asinhDependencies,
  atanDependencies,
  atanhDependencies,
  cosDependencies,
  coshDependencies,
  cotDependencies,
  cothDependencies,
  create,
  cscDependencies,
  cschDependencies,
  derivativeDependencies,
  divideDependencies,
  expDependencies,
  log10Dependencies,
  logDependencies,
  multiplyDependencies,
  parseDependencies,
  powDependencies,
  secDependencies,
  sechDependencies,
  simplifyDependencies,
  sinDependencies,
  sinhDependencies,
  sqrtDependencies,
  subtractDependencies,
  tanDependencies,
  tanhDependencies,
  unaryMinusDependencies,
  unaryPlusDependencies,
} from 'mathjs/number';

/**
 * The one mathjs instance the expression engine uses: parse, derivative and simplify only.
 *
 * Why the `mathjs/number` factory build rather than `create(all)`:
 * - size: this whole folder bundles to about 190 kB minified, 54 kB gzipped, against 650 kB and
 *   178 kB for `create(all)` alone (rolldown, mathjs 15.2.0), because BigNumber, Fraction,
 *   Complex, matrices, units and the evaluator stay out;
 * - semantics: every constant that simplify folds is a plain JS number, so `sqrt(-1)` folds to NaN
 *   exactly as `Math.sqrt` does at run time, instead of to a Complex the compiler could not use.
 *
 * simplify folds constant sub-expressions by calling the instance's own functions, so every
 * whitelisted function and every arithmetic operator has to be in the instance: without them
 * simplify throws "Cannot read properties of undefined (reading 'apply')".
 *
 * Only these three are ever called, and only inside parsePotential; evaluation never touches mathjs.
 */
export const math = create(
  {
    parseDependencies,
    derivativeDependencies,
    simplifyDependencies,
    addDependencies,
    subtractDependencies,
    multiplyDependencies,
    divideDependencies,
    powDependencies,
    unaryMinusDependencies,
    unaryPlusDependencies,
    sqrtDependencies,
    expDependencies,
    logDependencies,
    log10Dependencies,
    sinDependencies,
    cosDependencies,
    tanDependencies,
    secDependencies,
    cscDependencies,
    cotDependencies,
    asinDependencies,
    acosDependencies,
    atanDependencies,
    sinhDependencies,
    coshDependencies,
    tanhDependencies,
    sechDependencies,
    cschDependencies,
    cothDependencies,
    asinhDependencies,
    acoshDependencies,
    atanhDependencies,
    absDependencies,
  },
  {},
);
