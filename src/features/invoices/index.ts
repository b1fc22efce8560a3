// What other features may show of deposits and invoices besides the api/ hooks.
export { DepositAfterAccept } from './components/deposit-after-accept';
export { DepositStatus } from './components/deposit-status';
