import type { Client } from '../models';
import type { ClientDto } from '../../shared/schemas/client';

/** A client with the count and acres of its properties. */
export function presentClient(client: Client, stats: { propertyCount: number; totalAcres: number }): ClientDto {
  return {
    id: client.id,
    name: client.name,
    email: client.email,
    phone: client.phone,
    address: client.address,
    notes: client.notes,
    portalUploadsAllowed: client.portalUploadsAllowed,
    portalObservationsAllowed: client.portalObservationsAllowed,
    propertyCount: stats.propertyCount,
    totalAcres: Math.round(stats.totalAcres * 100) / 100,
    createdAt: client.createdAt.toISOString(),
    updatedAt: client.updatedAt.toISOString(),
  };
}
