// What the rest of the app may use from the session feature.
export { SignInForm } from './components/sign-in-form';
export { SignOutButton } from './components/sign-out-button';
export { ChangePasswordForm } from './components/change-password-form';
export { AccountSummary } from './components/account-summary';
export { useCurrentUser } from './hooks/use-current-user';
export { ForgotPasswordForm } from './components/forgot-password-form';
export { SetPasswordForm } from './components/set-password-form';
