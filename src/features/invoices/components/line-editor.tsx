import { useFieldArray, useFormContext } from 'react-hook-form';
import { TAX_CLASSES, TAX_CLASS_LABELS } from '../../../../shared/api/settings';
import { Button, Input } from '../../../components/ui';
import { FormSelect, useFieldError } from '../../../lib/forms';
import { emptyLine, type LineValues } from './line-form-schema';

function Cell({
  path,
  className,
  children,
}: {
  path: string;
  className?: string;
  children: (props: ReturnType<typeof useFieldError>['props']) => React.ReactNode;
}) {
  const error = useFieldError(path);
  return (
    <div className={`flex flex-col gap-0.5 ${className ?? ''}`}>
      {children(error.props)}
      {error.node}
    </div>
  );
}

/** Rows of description, quantity, unit price and tax class at `name` of the form ("variations", "lines"), with add and remove. */
export function LineEditor({ name, label }: { name: string; label: string }) {
  const { register, control } = useFormContext<Record<string, LineValues[]>>();
  const { fields, append, remove } = useFieldArray({ control, name });
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 text-sm font-medium text-graphite">{label}</legend>
      {fields.map((f, i) => {
        const at = (k: keyof LineValues) => `${name}.${i}.${k}` as const;
        return (
          <div key={f.id} className="grid grid-cols-2 items-start gap-2 sm:grid-cols-[minmax(0,1fr)_5rem_7rem_minmax(0,12rem)_auto]">
            {/* The description takes the whole row on a phone so it is not squeezed below a usable size. */}
            <Cell path={at('description')} className="col-span-2 sm:col-span-1">
              {(p) => <Input aria-label={`Line ${i + 1} description`} placeholder="What was done" {...p} {...register(at('description'))} />}
            </Cell>
            <Cell path={at('quantity')}>{(p) => <Input aria-label={`Line ${i + 1} quantity`} inputMode="decimal" {...p} {...register(at('quantity'))} />}</Cell>
            <Cell path={at('unitPriceMinor')}>
              {(p) => <Input aria-label={`Line ${i + 1} unit price`} inputMode="decimal" placeholder="0.00" {...p} {...register(at('unitPriceMinor'))} />}
            </Cell>
            <FormSelect aria-label={`Line ${i + 1} tax class`} name={at('taxClass')}>
              {TAX_CLASSES.map((c) => (
                <option key={c} value={c}>
                  {TAX_CLASS_LABELS[c]}
                </option>
              ))}
            </FormSelect>
            <Button variant="danger-ghost" size="sm" aria-label={`Remove line ${i + 1}`} onClick={() => remove(i)}>
              Remove
            </Button>
          </div>
        );
      })}
      <div>
        <Button variant="secondary" size="sm" onClick={() => append(emptyLine())}>
          Add a line
        </Button>
      </div>
    </fieldset>
  );
}
