export { useZodForm } from './use-zod-form';
export { showServerErrors } from './server-errors';
export { setErrorOnSentRows } from './sent-rows';
export { booleanText, moneyText, numberText, percentText, trimmedText } from './text-fields';
export { FormField, hasFieldErrors, useFieldError } from './form-field';
export { FormSelect } from './form-select';
