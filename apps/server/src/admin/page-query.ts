// `?page&pageSize` of the admin lists: the schema lives in the contracts, where the browser reads it too.
export { adminPageQuerySchema as pageQuerySchema } from '@seinework/contracts';
