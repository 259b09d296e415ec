module.exports = { ...require('../jest.base.cjs'), testTimeout: 60_000 };
