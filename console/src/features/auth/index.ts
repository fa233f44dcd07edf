export { AcceptInvite } from './components/accept-invite-form';
export { ConfirmEmail } from './components/confirm-email';
export { ForgotPasswordForm } from './components/forgot-password-form';
export { ResetPasswordForm } from './components/reset-password-form';
export { SignInForm } from './components/sign-in-form';
export { SignUpForm } from './components/sign-up-form';
