import { Navigate, type RouteObject } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { page } from '../../lazy-page';

/** The Library's routes, for the consultant shell: /library/practices, /library/practices/:id, /library/materials, /library/rates (each page its own chunk). */
export const libraryRoutes: RouteObject = {
  path: paths.library,
  ...page(() => import('./library-layout'), (m) => m.LibraryLayout),
  children: [
    { index: true, element: <Navigate to={paths.libraryPractices} replace /> },
    { path: paths.libraryPractices, ...page(() => import('./practices'), (m) => m.PracticesPage) },
    { path: paths.practice(), ...page(() => import('./practice'), (m) => m.PracticePage) },
    { path: paths.libraryMaterials, ...page(() => import('./materials'), (m) => m.MaterialsPage) },
    { path: paths.libraryRates, ...page(() => import('./rates'), (m) => m.RatesPage) },
  ],
};
