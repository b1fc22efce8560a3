// What other features may show of the installer's records besides the api/ hooks: correcting what was used.
export { ActualsEditor } from './components/actuals-editor';
