// The TypeORM CLI's data source (exactly one export): `typeorm -d dist/database/data-source.js`.
import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { loadConfig } from '../config/config.js';
import { typeormOptions } from './typeorm.options.js';

export default new DataSource(typeormOptions(loadConfig().databaseUrl));
