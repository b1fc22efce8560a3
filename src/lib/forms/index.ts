export { useZodForm } from './use-zod-form';
export { showServerErrors } from './server-errors';
export { FormField, hasFieldErrors } from './form-field';
