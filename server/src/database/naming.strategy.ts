// snake_case table and column names, so SQL written by hand reads naturally.
import { DefaultNamingStrategy, NamingStrategyInterface } from 'typeorm';

const snake = (s: string) =>
  s
    .replace(/([a-z0-9])([A-Z])/g, '$1_$2')
    .replace(/([A-Z])([A-Z][a-z])/g, '$1_$2')
    .toLowerCase();

export class SnakeNamingStrategy extends DefaultNamingStrategy implements NamingStrategyInterface {
  override tableName(className: string, customName?: string): string {
    return customName ?? snake(className);
  }
  override columnName(propertyName: string, customName: string | undefined, prefixes: string[]) {
    return snake(prefixes.concat('').join('_')) + (customName ?? snake(propertyName));
  }
  override relationName(propertyName: string): string {
    return snake(propertyName);
  }
  override joinColumnName(relationName: string, referencedColumnName: string): string {
    return snake(`${relationName}_${referencedColumnName}`);
  }
  override joinTableName(first: string, second: string, firstProp: string): string {
    return snake(`${first}_${firstProp.replace(/\./g, '_')}_${second}`);
  }
  override joinTableColumnName(tableName: string, propertyName: string, columnName?: string) {
    return snake(`${tableName}_${columnName ?? propertyName}`);
  }
}
