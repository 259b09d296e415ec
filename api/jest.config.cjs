module.exports = { ...require('../jest.base.cjs'), testTimeout: 30_000 };
