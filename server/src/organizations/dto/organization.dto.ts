import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsString, IsUUID, Length } from 'class-validator';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

export class UpdateOrganizationRequestDto {
  @ApiProperty({ minLength: 1, maxLength: 100, example: 'Kestrelmoor Evening Portraits' })
  @Transform(trim)
  @IsString()
  @Length(1, 100)
  name: string;
}

export class DeleteOrganizationRequestDto {
  @ApiProperty({
    description: "The organisation's exact name, to confirm.",
    example: 'Kestrelmoor Evening Portraits',
  })
  @IsString()
  @Length(1, 100)
  confirmName: string;
}

export class TransferOwnershipRequestDto {
  @ApiProperty({ format: 'uuid', description: 'The member who becomes owner; you become admin.' })
  @IsUUID()
  userId: string;
}
