/**
 * Front-end pieces both apps share (React, Joy UI, TanStack Query). Imported as
 * '@loomwright/shared/ui' through each app's Vite alias; never by the API, which has no UI.
 */
export { createQueryClient } from './query-client';
export { PageLoading } from './PageLoading';
export { RouteError, RouteErrorScreen } from './RouteError';
export { ShopUnavailable } from './ShopUnavailable';
export { NotFoundPage } from './NotFoundPage';
export { mountApp } from './mount-app';
export { FormTextField } from './FormTextField';
export { EmailField, NewPasswordForm, PasswordField, SignInForm } from './account-forms';
export { authKeys, getMe, ME_RETRY_MS, meQueryOptions, switchPerson, useMe } from './get-me';
export { useSearchParamsInOrder } from './use-search-params-in-order';
export { MoneyFactsTable } from './MoneyFactsTable';
export { ShopVoiceProvider, currentShopVoice, useShopVoice } from './shop-voice';
export { currentShopFormat, useShopFormat } from './current-shop-format';
export { documentTitle, useRouteTitle, type RouteTitleHandle } from './use-route-title';
export { ConversationPanel, messageKeys, UnreadCountChip, UnreadMessagesBadge, useUnreadMessages } from './ConversationPanel';
export { ApiErrorAlert } from './ApiErrorAlert';
export {
  errorAdvice,
  fieldsCoverError,
  formFieldName,
  setServerFieldErrors,
  type ErrorAdviceKind,
  type FieldErrorOptions,
} from './error-advice';
export { signIn, signOut, useSignIn, useSignOut } from './sign-in-out';
