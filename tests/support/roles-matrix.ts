// The route matrix the API tests walk is the product's own access map (shared/access.ts).
export { API_ACCESS as MATRIX, type Who } from '../../shared/access'
