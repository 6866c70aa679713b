// @ts-check
// Worker threads get neither jest's nor tsx's transform: register tsx here, then load the TS worker.
const tsx = require('tsx/cjs/api');

const mod = tsx.require('./calc.worker.ts', __filename);
module.exports = mod.default ?? mod;
