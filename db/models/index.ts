import { getSequelize } from '../sequelize';
import { Company, initCompany } from './company';
import { Membership, initMembership } from './membership';
import { Plan, initPlan } from './plan';
import { Session, initSession } from './session';
import { User, initUser } from './user';
import { Invitation, initInvitation } from './invitation';
import { PasswordResetToken, initPasswordResetToken } from './password-reset-token';
import { SignInAttempt, initSignInAttempt } from './sign-in-attempt';
import { AuditEvent, initAuditEvent } from './audit-event';
import { SignupRequest, initSignupRequest } from './signup-request';
// Studies: customers, sites, services, dish catalogue, climate, uploads, studies.
import { Customer, initCustomer } from './customer';
import { Site, initSite } from './site';
import { ServiceProfile, initServiceProfile } from './service-profile';
import { Dish, initDish } from './dish';
import { Upload, initUpload } from './upload';
import { ClimateProfile, initClimateProfile } from './climate-profile';
import { Study, initStudy } from './study';
// Billing: subscriptions, checkouts opened from the app, webhook events received.
import { Subscription, initSubscription } from './subscription';
import { BillingCheckout, initBillingCheckout } from './billing-checkout';
import { WebhookEvent, initWebhookEvent } from './webhook-event';
// Quotes: quotes, their status history, comparison links.
import { Quote, initQuote } from './quote';
import { QuoteEvent, initQuoteEvent } from './quote-event';
import { ShareLink, initShareLink } from './share-link';
// Integrators: API keys.
import { ApiKey, initApiKey } from './api-key';

export { Company, Membership, Plan, Session, User };
export { Invitation, PasswordResetToken, SignInAttempt, AuditEvent, SignupRequest };
export type { CompanyRole } from './membership';
export { Customer, Site, ServiceProfile, Dish, Upload, ClimateProfile, Study };
export { COMPANY_ROLES } from './membership';
export { Subscription, BillingCheckout, WebhookEvent };
export type { SubscriptionStatus } from './subscription';
export { Quote, QuoteEvent, ShareLink };
export { ApiKey };

let ready = false;

/**
 * Initialises every model on the one Sequelize instance (once) and wires associations.
 * Call it before using a model class: `const { Study } = models();`.
 */
export function models() {
  if (!ready) {
    const sequelize = getSequelize();
    initPlan(sequelize);
    initCompany(sequelize);
    initUser(sequelize);
    initMembership(sequelize);
    initSession(sequelize);
    initInvitation(sequelize);
    initPasswordResetToken(sequelize);
    initSignInAttempt(sequelize);
    initAuditEvent(sequelize);
    initSignupRequest(sequelize);

    Company.belongsTo(Plan, { foreignKey: 'planId', as: 'plan' });
    Membership.belongsTo(Company, { foreignKey: 'companyId', as: 'company' });
    Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });
    Company.hasMany(Membership, { foreignKey: 'companyId', as: 'memberships' });
    User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });
    Session.belongsTo(User, { foreignKey: 'userId', as: 'user' });
    Invitation.belongsTo(Company, { foreignKey: 'companyId', as: 'company' });
    Invitation.belongsTo(User, { foreignKey: 'invitedByUserId', as: 'invitedBy' });
    PasswordResetToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });
    initCustomer(sequelize);
    initSite(sequelize);
    initServiceProfile(sequelize);
    initDish(sequelize);
    initUpload(sequelize);
    initClimateProfile(sequelize);
    initStudy(sequelize);
    Site.belongsTo(Customer, { foreignKey: 'customerId', as: 'customer' });
    Customer.hasMany(Site, { foreignKey: 'customerId', as: 'sites' });
    initSubscription(sequelize);
    initBillingCheckout(sequelize);
    initWebhookEvent(sequelize);
    Subscription.belongsTo(Plan, { foreignKey: 'planId', as: 'plan' });
    Subscription.belongsTo(Company, { foreignKey: 'companyId', as: 'company' });
    initQuote(sequelize);
    initQuoteEvent(sequelize);
    initShareLink(sequelize);
    initApiKey(sequelize);
    ready = true;
  }
  return { sequelize: getSequelize(), Customer, Site, ServiceProfile, Dish, Upload, ClimateProfile, Study, Plan, Company, User, Membership, Session, Invitation, PasswordResetToken, SignInAttempt, AuditEvent, SignupRequest, Subscription, BillingCheckout, WebhookEvent, Quote, QuoteEvent, ShareLink, ApiKey };
}
