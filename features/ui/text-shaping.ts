/** Native platforms shape text as written already; the web build turns off Inter's `calt` here. */
export function installPlainShaping(): void {}
