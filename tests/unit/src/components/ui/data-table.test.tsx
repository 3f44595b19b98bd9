// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { MemoryRouter, Route, Routes, useLocation } from 'react-router-dom';
import { DataTable, foldText, type DataColumn } from '../../../../../src/components/ui/data-table';

interface Row {
  id: number;
  name: string;
  acres: number | null;
}

const COLUMNS: DataColumn<Row>[] = [
  { id: 'name', header: 'Name', value: (r) => r.name },
  { id: 'acres', header: 'Acres', value: (r) => r.acres, align: 'right' },
];

// Invented rows; the expectations below follow from them and from the component's contract.
const FEW: Row[] = [
  { id: 1, name: 'Kettle Hollow', acres: 149.6 },
  { id: 2, name: 'bluestem Ridge', acres: 276.4 },
  { id: 3, name: 'Sawmill Ridge 80', acres: null },
  { id: 4, name: 'Sawmill Ridge 9', acres: 9.5 },
];

const many = (n: number): Row[] => Array.from({ length: n }, (_, i) => ({ id: i + 1, name: `Tract ${String(i + 1).padStart(3, '0')}`, acres: i + 1 }));

function Where() {
  return <p data-testid="where">{useLocation().pathname}</p>;
}

function renderTable(data: Row[], extra: Partial<Parameters<typeof DataTable<Row>>[0]> = {}) {
  return render(
    <MemoryRouter initialEntries={['/list']}>
      <Routes>
        <Route path="*" element={<><DataTable data={data} columns={COLUMNS} label="Tracts" noun={['tract', 'tracts']} rowKey={(r) => r.id} {...extra} /><Where /></>} />
      </Routes>
    </MemoryRouter>,
  );
}

const bodyNames = () => within(screen.getByRole('table')).getAllByRole('rowheader').map((c) => c.textContent);
const header = (name: string) => screen.getByRole('columnheader', { name: new RegExp(name) });

afterEach(cleanup);

describe('DataTable sorting', () => {
  it('sorts text naturally and case-blind, toggling ascending and descending, and says so in aria-sort', () => {
    renderTable(FEW);
    expect(header('Name').getAttribute('aria-sort')).toBe('none');
    fireEvent.click(within(header('Name')).getByRole('button'));
    expect(header('Name').getAttribute('aria-sort')).toBe('ascending');
    // "9" before "80": numeric-aware collation (Intl.Collator numeric option, ECMA-402)
    expect(bodyNames()).toEqual(['bluestem Ridge', 'Kettle Hollow', 'Sawmill Ridge 9', 'Sawmill Ridge 80']);
    fireEvent.click(within(header('Name')).getByRole('button'));
    expect(header('Name').getAttribute('aria-sort')).toBe('descending');
    expect(bodyNames()).toEqual(['Sawmill Ridge 80', 'Sawmill Ridge 9', 'Kettle Hollow', 'bluestem Ridge']);
  });

  it('sorts numbers largest first on the first click and keeps empty values last in both directions', () => {
    renderTable(FEW);
    const button = within(header('Acres')).getByRole('button');
    fireEvent.click(button);
    expect(header('Acres').getAttribute('aria-sort')).toBe('descending');
    expect(bodyNames()).toEqual(['bluestem Ridge', 'Kettle Hollow', 'Sawmill Ridge 9', 'Sawmill Ridge 80']);
    fireEvent.click(button);
    expect(header('Acres').getAttribute('aria-sort')).toBe('ascending');
    expect(bodyNames()).toEqual(['Sawmill Ridge 9', 'Kettle Hollow', 'bluestem Ridge', 'Sawmill Ridge 80']);
    expect(header('Name').getAttribute('aria-sort')).toBe('none');
  });
});

describe('DataTable paging', () => {
  it('shows 25 rows a page with "Page n of m" and Previous/Next that stop at the ends', () => {
    renderTable(many(60), { initialSort: { id: 'name' } });
    expect(bodyNames()).toHaveLength(25);
    expect(screen.getByText('Page 1 of 3')).toBeTruthy();
    expect(screen.getByText('1–25 of 60 tracts')).toBeTruthy();
    const prev = screen.getByRole('button', { name: 'Previous' }) as HTMLButtonElement;
    const next = screen.getByRole('button', { name: 'Next' }) as HTMLButtonElement;
    expect(prev.disabled).toBe(true);
    fireEvent.click(next);
    expect(screen.getByText('Page 2 of 3')).toBeTruthy();
    expect(bodyNames()[0]).toBe('Tract 026');
    fireEvent.click(next);
    expect(screen.getByText('Page 3 of 3')).toBeTruthy();
    expect(bodyNames()).toHaveLength(10);
    expect(next.disabled).toBe(true);
    fireEvent.click(prev);
    expect(screen.getByText('Page 2 of 3')).toBeTruthy();
  });

  it('goes back to page 1 when the sort or the search changes', () => {
    renderTable(many(60), { initialSort: { id: 'name' } });
    fireEvent.click(screen.getByRole('button', { name: 'Next' }));
    fireEvent.click(within(header('Acres')).getByRole('button'));
    expect(screen.getByText('Page 1 of 3')).toBeTruthy();
    expect(bodyNames()[0]).toBe('Tract 060');
    fireEvent.click(screen.getByRole('button', { name: 'Next' }));
    fireEvent.change(screen.getByLabelText('Filter tracts'), { target: { value: 'tract 05' } });
    expect(screen.queryByText(/Page \d of/)).toBeNull();
    expect(bodyNames()).toHaveLength(10);
  });

  it('hides the page controls when everything fits on one page', () => {
    renderTable(FEW);
    expect(screen.queryByRole('button', { name: 'Next' })).toBeNull();
    expect(screen.getByText('4 tracts')).toBeTruthy();
  });
});

describe('DataTable search, empty state and row links', () => {
  it('finds rows whatever the case and accents, and offers to clear a search that finds nothing', () => {
    renderTable([...FEW, { id: 5, name: 'Havlíček Bottom', acres: 40 }]);
    fireEvent.change(screen.getByLabelText('Filter tracts'), { target: { value: 'HAVLICEK' } });
    expect(bodyNames()).toEqual(['Havlíček Bottom']);
    fireEvent.change(screen.getByLabelText('Filter tracts'), { target: { value: 'nowhere' } });
    expect(screen.queryByRole('table')).toBeNull();
    expect(screen.getByText('No tracts match “nowhere”.')).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'clear the search' }));
    expect(bodyNames()).toHaveLength(5);
  });

  it('shows the empty slot instead of the table when there are no rows at all', () => {
    renderTable([], { empty: <p>Add your first tract.</p> });
    expect(screen.getByText('Add your first tract.')).toBeTruthy();
    expect(screen.queryByRole('table')).toBeNull();
  });

  it('puts a real link in the first cell and navigates on a click elsewhere in the row', () => {
    renderTable(FEW, { rowHref: (r) => `/tracts/${r.id}`, initialSort: { id: 'name' } });
    const link = screen.getByRole('link', { name: 'Kettle Hollow' });
    expect(link.getAttribute('href')).toBe('/tracts/1');
    const acresCell = screen.getByText('276.4');
    fireEvent.click(acresCell);
    expect(screen.getByTestId('where').textContent).toBe('/tracts/2');
  });

  it('folds accents and case for search', () => {
    expect(foldText('Havlíček')).toBe('havlicek');
  });
});
