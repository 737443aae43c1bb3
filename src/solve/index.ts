// Closed-form stub solutions (the `solve` stage).
export { solveSingleStub, openStubWl, shortStubWl, mismatchGamma, MATCH_TOLERANCE, type StubProblem } from './singleStub.js';
