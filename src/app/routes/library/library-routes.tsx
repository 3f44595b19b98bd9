import { Navigate, type RouteObject } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { LibraryLayout } from './library-layout';
import { PracticesPage } from './practices';
import { PracticePage } from './practice';
import { MaterialsPage } from './materials';
import { RatesPage } from './rates';

/** The Library's routes, for the consultant shell: /library/practices, /library/practices/:id, /library/materials, /library/rates. */
export const libraryRoutes: RouteObject = {
  path: paths.library,
  element: <LibraryLayout />,
  children: [
    { index: true, element: <Navigate to={paths.libraryPractices} replace /> },
    { path: paths.libraryPractices, element: <PracticesPage /> },
    { path: paths.practice(), element: <PracticePage /> },
    { path: paths.libraryMaterials, element: <MaterialsPage /> },
    { path: paths.libraryRates, element: <RatesPage /> },
  ],
};
