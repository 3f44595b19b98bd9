import { Fragment, useState, type ReactNode } from 'react';
import { ArchiveControl } from './archive-control';
import { TextButton } from '../../../components/ui/text-button';
import { formatCents } from '../../../../shared/domain/money';
import { formatGrade } from '../../../../shared/domain/fertilizer';
import { plsPercent } from '../../../../shared/domain/seeding';
import type { MaterialDto, MaterialKind } from '../../../../shared/schemas/library';
import { formatQuantity } from '../../../lib/quantity-format';
import { useArchiveMaterial } from '../api/archive-material';
import { MaterialForm } from './material-form';

interface Column {
  header: string;
  align?: 'right';
  cell: (m: MaterialDto) => ReactNode;
}

const price = (cents: number) => formatCents(cents);

const COLUMNS: Record<MaterialKind, Column[]> = {
  seed: [
    { header: 'Species', cell: (m) => (m.type === 'seed' ? m.species : '') },
    {
      header: 'Purity × germination',
      align: 'right',
      cell: (m) => (m.type === 'seed' ? `${formatQuantity(m.purityPct, 1)} % × ${formatQuantity(m.germinationPct, 1)} %${m.dormantPct ? ` (+${formatQuantity(m.dormantPct, 1)} % dormant)` : ''}` : ''),
    },
    { header: 'PLS', align: 'right', cell: (m) => (m.type === 'seed' ? `${formatQuantity(plsPercent(m), 1)} %` : '') },
    { header: 'Package', align: 'right', cell: (m) => (m.type === 'seed' ? `${formatQuantity(m.packageSizeLb)} lb` : '') },
    { header: 'Price', align: 'right', cell: (m) => (m.type === 'seed' ? price(m.packagePriceCents) : '') },
  ],
  lime: [
    { header: 'ENM', align: 'right', cell: (m) => (m.type === 'lime' && m.enmLbPerTon !== undefined ? `${formatQuantity(m.enmLbPerTon, 0)} lb/ton` : '—') },
    { header: 'Sold', cell: (m) => (m.type === 'lime' ? (m.pricing.basis === 'bag' ? `${formatQuantity(m.pricing.bagSizeLb)}-lb bag` : 'by the ton') : '') },
    { header: 'Price', align: 'right', cell: (m) => (m.type === 'lime' ? (m.pricing.basis === 'bag' ? price(m.pricing.bagPriceCents) : `${price(m.pricing.pricePerTonCents)}/ton`) : '') },
  ],
  fertilizer: [
    { header: 'Grade (N-P₂O₅-K₂O)', cell: (m) => (m.type === 'fertilizer' ? formatGrade(m.grade) : '') },
    { header: 'Bag', align: 'right', cell: (m) => (m.type === 'fertilizer' ? `${formatQuantity(m.bagSizeLb)} lb` : '') },
    { header: 'Price', align: 'right', cell: (m) => (m.type === 'fertilizer' ? price(m.bagPriceCents) : '') },
  ],
  herbicide: [
    {
      header: 'Active ingredient',
      cell: (m) =>
        m.type === 'herbicide' || m.type === 'adjuvant' ? (
          <>
            {m.activeIngredient}
            {m.type === 'adjuvant' ? <span className="ml-2 rounded border border-sky/40 px-1.5 text-xs text-ink">adjuvant</span> : null}
            {m.restrictedUse ? <span className="ml-2 rounded bg-clay/10 px-1.5 text-xs font-semibold text-[#A04A25]">restricted use</span> : null}
          </>
        ) : (
          ''
        ),
    },
    { header: 'EPA Reg. No.', cell: (m) => ((m.type === 'herbicide' || m.type === 'adjuvant') && m.epaRegNo ? m.epaRegNo : '—') },
    { header: 'Concentration', align: 'right', cell: (m) => ((m.type === 'herbicide' || m.type === 'adjuvant') && m.lbAiPerGal !== undefined ? `${formatQuantity(m.lbAiPerGal)} lb/gal` : '—') },
    { header: 'Sold', cell: (m) => (m.type === 'herbicide' || m.type === 'adjuvant' ? (m.pricing.basis === 'container' ? `${formatQuantity(m.pricing.containerSizeGal)}-gal container` : 'by the gallon') : '') },
    { header: 'Price', align: 'right', cell: (m) => (m.type === 'herbicide' || m.type === 'adjuvant' ? (m.pricing.basis === 'container' ? price(m.pricing.containerPriceCents) : `${price(m.pricing.pricePerGalCents)}/gal`) : '') },
  ],
  other: [
    { header: 'Item', cell: (m) => (m.type === 'item' ? m.itemLabel : '') },
    { header: 'Pack', cell: (m) => (m.type === 'item' ? `${m.packLabel} (${m.packSize})` : '') },
    { header: 'Price', align: 'right', cell: (m) => (m.type === 'item' ? price(m.packPriceCents) : '') },
  ],
};

function ArchiveButton({ material }: { material: MaterialDto }) {
  const archive = useArchiveMaterial();
  return <ArchiveControl id={material.id} name={material.name} archive={archive} />;
}

/** A table of the materials of one kind, each with Edit (the kind's form, inline) and Archive. */
export function MaterialTable({ kind, materials }: { kind: MaterialKind; materials: MaterialDto[] }) {
  const [editingId, setEditingId] = useState<number | null>(null);
  const columns = COLUMNS[kind];
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <thead>
          <tr className="border-b border-rule text-left text-xs uppercase tracking-wide text-slate">
            <th className="py-2 pr-3 font-semibold">Name</th>
            {columns.map((c) => (
              <th key={c.header} className={`py-2 pr-3 font-semibold ${c.align === 'right' ? 'text-right' : ''}`}>
                {c.header}
              </th>
            ))}
            <th className="py-2 text-right font-semibold">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {materials.map((m) => (
            <Fragment key={m.id}>
              <tr className="border-b border-rule/60 align-top last:border-0">
                <th scope="row" className="py-2 pr-3 text-left font-semibold">
                  {m.name}
                </th>
                {columns.map((c) => (
                  <td key={c.header} className={`py-2 pr-3 ${c.align === 'right' ? 'text-right tabular-nums' : ''}`}>
                    {c.cell(m)}
                  </td>
                ))}
                <td className="whitespace-nowrap py-1 text-right">
                  <TextButton onClick={() => setEditingId(editingId === m.id ? null : m.id)} aria-label={`Edit ${m.name}`}>
                    Edit
                  </TextButton>
                  <ArchiveButton material={m} />
                </td>
              </tr>
              {editingId === m.id ? (
                <tr className="border-b border-rule/60 bg-paper/60">
                  <td colSpan={columns.length + 2} className="px-3 py-3">
                    <MaterialForm kind={kind} material={m} onDone={() => setEditingId(null)} />
                  </td>
                </tr>
              ) : null}
            </Fragment>
          ))}
        </tbody>
      </table>
    </div>
  );
}
