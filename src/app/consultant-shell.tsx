import { ConsultantLayout } from '../components/layouts/consultant-layout';
import { HeaderSearch } from '../features/search/components/header-search';

/** The consultant's layout with the header search put in (the layout itself imports no feature). */
export function ConsultantShell() {
  return <ConsultantLayout search={<HeaderSearch />} />;
}
