import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { config } from '../config.ts'
import { allow } from '../middleware/access.ts'
import { listStreets } from '../services/streets.ts'

/** The base map: the street layer and where the map opens. */
export function mapRouter(sequelize: Sequelize): Router {
  const router = Router()

  router.get('/streets', allow('signed-in'), async (_req, res) => {
    res.json(await listStreets(sequelize, config().PROJECTED_EPSG))
  })

  router.get('/map/settings', allow('signed-in'), async (_req, res) => {
    const streets = await listStreets(sequelize, config().PROJECTED_EPSG)
    const coords = streets.features.flatMap((f) => f.geometry.coordinates)
    const lons = coords.map((c) => c[0])
    const lats = coords.map((c) => c[1])
    const extent = coords.length
      ? [Math.min(...lons), Math.min(...lats), Math.max(...lons), Math.max(...lats)]
      : null
    res.json({
      center_lonlat: extent
        ? [(extent[0]! + extent[2]!) / 2, (extent[1]! + extent[3]!) / 2]
        : [9.95, 52.6],
      extent_lonlat: extent,
      zoom: 15,
      projectedEpsg: config().PROJECTED_EPSG,
    })
  })

  return router
}
