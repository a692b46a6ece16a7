import { Sequelize } from 'sequelize';

export function createSequelize(databaseUrl: string): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'mariadb',
    logging: false,
    timezone: '+00:00',
    define: { underscored: true },
    pool: { max: 10, min: 0, idle: 10_000 },
  });
}
