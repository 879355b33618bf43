import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { PlanId } from '@wickstone/contracts';

/** A firm's plan and subscription as the payments provider last reported it; no row is the free plan. */
export class BillingAccount extends Model<
  InferAttributes<BillingAccount>,
  InferCreationAttributes<BillingAccount>
> {
  declare organizationId: number;
  declare plan: PlanId;
  /** The provider's subscription status: active, past_due, unpaid, canceled, incomplete... */
  declare status: string;
  declare customerId: string | null;
  declare subscriptionId: string | null;
  declare currentPeriodEnd: Date | null;
  declare cancelAtPeriodEnd: CreationOptional<boolean>;
  declare nextPaymentAttempt: Date | null;
  declare syncedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    BillingAccount.init(
      {
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        plan: { type: DataTypes.STRING(20), allowNull: false },
        status: { type: DataTypes.STRING(30), allowNull: false },
        customerId: { type: DataTypes.STRING(100), allowNull: true },
        subscriptionId: { type: DataTypes.STRING(100), allowNull: true },
        currentPeriodEnd: { type: DataTypes.DATE(3), allowNull: true },
        cancelAtPeriodEnd: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        nextPaymentAttempt: { type: DataTypes.DATE(3), allowNull: true },
        syncedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'billing_accounts', underscored: true },
    );
  }
}
