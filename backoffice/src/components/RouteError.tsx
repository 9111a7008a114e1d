import { RouteError as SharedRouteError } from '@loomwright/shared/ui';

export const RouteError = () => <SharedRouteError homeHref="/backoffice/" />;
