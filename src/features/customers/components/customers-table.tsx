import type { Customer } from '../../../../shared/api/customers';
import { Button, Table, TBody, Td, Th, THead, Tr, formatAddress } from '../../../components/ui';

/** The company's customers; rows offer an edit button when the user may change them. */
export function CustomersTable({ customers, onEdit }: { customers: Customer[]; onEdit?: (c: Customer) => void }) {
  return (
    <Table aria-label="Customers">
      <THead>
        <tr>
          <Th>Name</Th>
          <Th className="hidden sm:table-cell">Contact</Th>
          <Th>Address</Th>
          {onEdit && (
            <Th className="w-px">
              <span className="sr-only">Actions</span>
            </Th>
          )}
        </tr>
      </THead>
      <TBody>
        {customers.map((c) => (
          <Tr key={c.id}>
            <Td className="font-medium">
              {c.name}
              <div className="mt-0.5 text-xs font-normal text-graphite-light sm:hidden">{c.phone || c.email}</div>
            </Td>
            <Td className="hidden text-graphite-light sm:table-cell">
              <div>{c.email}</div>
              <div>{c.phone}</div>
            </Td>
            <Td className="text-graphite-light">{formatAddress(c.address)}</Td>
            {onEdit && (
              <Td>
                <Button size="sm" variant="ghost" onClick={() => onEdit(c)} aria-label={`Edit ${c.name}`}>
                  Edit
                </Button>
              </Td>
            )}
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
