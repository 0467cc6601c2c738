'use strict';

module.exports = async function globalTeardown() {
  await globalThis.__provenoteServices?.stop();
};
