import { describe, expect, it } from 'vitest';
import { ESLint } from 'eslint';

/**
 * The layer zones in eslint.config.js (DEVELOPERS.md, "Layers"): an import across a zone fails lint,
 * one inside its zone passes. Each case lints a made-up file at a real place in the tree.
 */
const eslint = new ESLint({ cwd: process.cwd() });

async function zoneErrors(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.filter((m) => m.ruleId === 'boundaries/dependencies').map((m) => m.message);
}

describe('lint zones', () => {
  it('a feature may not import another feature, but may import itself, src/lib and shared/', async () => {
    expect(await zoneErrors('src/features/desk/components/zz.ts', "import { useMe } from '../../auth/api/get-me';\nexport const x = useMe;\n")).toHaveLength(1);
    expect(await zoneErrors('src/features/desk/components/zz.ts', "import { useDesk } from '../api/get-desk';\nimport { api } from '../../../lib/api-client';\nimport { formatCents } from '../../../../shared/domain/money';\nexport const x = [useDesk, api, formatCents];\n")).toEqual([]);
  });

  it('src/components may not import src/features', async () => {
    expect(await zoneErrors('src/components/ui/zz.tsx', "import { useMe } from '../../features/auth/api/get-me';\nexport const x = useMe;\n")).toHaveLength(1);
  });

  it('templates may not import the server', async () => {
    expect(await zoneErrors('templates/documents/zz.ts', "import { renderPdf } from '../../server/services/documents/pdf';\nexport const x = renderPdf;\n")).toHaveLength(1);
    expect(await zoneErrors('templates/documents/zz.ts', "import { pageFrame } from './kit/layout';\nexport const x = pageFrame;\n")).toEqual([]);
  });

  it('presenters may not import commands or services', async () => {
    expect(await zoneErrors('server/presenters/zz.ts', "import { priceProposal } from '../services/proposals/pricing';\nexport const x = priceProposal;\n")).toHaveLength(1);
  });

  it('shared/ may not import the server', async () => {
    expect(await zoneErrors('shared/domain/zz.ts', "import { usableZone } from '../../server/services/clock';\nexport const x = usableZone;\n")).toHaveLength(1);
  });
});
