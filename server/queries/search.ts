/** The header search: one ranked, firm-scoped, typo-tolerant read over the firm's records. */
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { SEARCH_MAX_RESULTS, SEARCH_MIN_SIMILARITY, searchText, type SearchKind, type SearchResultDto } from '../../shared/schemas/search';

interface Row {
  kind: SearchKind;
  id: number;
  label: string;
  sublabel: string | null;
  href_id: number;
  score: number;
}

const HREF: Record<SearchKind, (id: number) => string> = {
  client: (id) => `/clients/${id}`,
  property: (id) => `/properties/${id}`,
  proposal: (id) => `/proposals/${id}`,
  invoice: (id) => `/invoices/${id}`,
  // A contact opens the client they belong to.
  contact: (id) => `/clients/${id}`,
};

/** A LIKE pattern that takes the text literally. */
const likeLiteral = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/**
 * The score of one text column against the query: trigram word similarity (0–1), plus 1 when the text
 * starts with the query and 0.5 when it contains it, so exact beginnings rank above near misses.
 */
const score = (col: string) => `(word_similarity(:q, ${col}) + CASE WHEN ${col} LIKE :prefix THEN 1 WHEN ${col} LIKE :infix THEN 0.5 ELSE 0 END)`;
/** Matches by containment or by trigram word similarity over the threshold (both served by the GIN trigram indexes). */
const matches = (col: string) => `(${col} LIKE :infix OR :q <% ${col})`;

const SQL = `
  SELECT * FROM (
    SELECT 'client' AS kind, c.id, c.name AS label, coalesce(c.email, c.address) AS sublabel, c.id AS href_id, ${score('lower(c.name)')} AS score
      FROM clients c WHERE c.firm_id = :firmId AND ${matches('lower(c.name)')}
    UNION ALL
    SELECT 'property', p.id, p.name, concat_ws(' · ', cl.name, nullif(concat_ws(', ', p.county, p.state), '')), p.id, ${score('lower(p.name)')}
      FROM properties p JOIN clients cl ON cl.id = p.client_id WHERE p.firm_id = :firmId AND ${matches('lower(p.name)')}
    UNION ALL
    SELECT 'proposal', pr.id, pr.number || CASE WHEN pr.version > 1 THEN ' v' || pr.version ELSE '' END, concat_ws(' · ', pr.title, cl.name, pr.status), pr.id, ${score('lower(pr.number)')}
      FROM proposals pr JOIN clients cl ON cl.id = pr.client_id
     WHERE pr.firm_id = :firmId AND ${matches('lower(pr.number)')}
       AND NOT EXISTS (SELECT 1 FROM proposals later WHERE later.firm_id = pr.firm_id AND later.number = pr.number AND later.version > pr.version)
    UNION ALL
    SELECT 'invoice', i.id, i.number, concat_ws(' · ', cl.name, i.status), i.id, ${score('lower(i.number)')}
      FROM invoices i JOIN clients cl ON cl.id = i.client_id WHERE i.firm_id = :firmId AND ${matches('lower(i.number)')}
    UNION ALL
    SELECT 'contact', u.id, u.name, concat_ws(' · ', u.email, cl.name), u.client_id, greatest(${score('lower(u.name)')}, ${score('lower(u.email)')})
      FROM users u JOIN clients cl ON cl.id = u.client_id
     WHERE u.firm_id = :firmId AND u.client_id IS NOT NULL AND (${matches('lower(u.name)')} OR ${matches('lower(u.email)')})
  ) hits
  ORDER BY score DESC, label ASC, id ASC
  LIMIT :limit`;

/**
 * The firm's clients, properties, proposals (latest version, by number), invoices (by number) and
 * client contacts matching the query, best first. Text with nothing searchable answers [] without a
 * query.
 */
export async function searchFirm(firmId: number, raw: string): Promise<SearchResultDto[]> {
  const q = searchText(raw);
  if (!q) return [];
  const rows = await sequelize.transaction(async (transaction) => {
    // The `<%` operator's threshold, for this transaction only.
    await sequelize.query(`SELECT set_config('pg_trgm.word_similarity_threshold', :t, true)`, { replacements: { t: String(SEARCH_MIN_SIMILARITY) }, type: QueryTypes.SELECT, transaction });
    const literal = likeLiteral(q);
    return sequelize.query<Row>(SQL, {
      replacements: { firmId, q, prefix: `${literal}%`, infix: `%${literal}%`, limit: SEARCH_MAX_RESULTS },
      type: QueryTypes.SELECT,
      transaction,
    });
  });
  return rows.map((r) => ({ kind: r.kind, id: r.id, label: r.label, ...(r.sublabel ? { sublabel: r.sublabel } : {}), href: HREF[r.kind](r.href_id) }));
}
