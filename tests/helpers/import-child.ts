/**
 * A separate process that runs the real network import (validate, then commit) of one file as
 * one engineer, the way the server does. Used by the fault test that kills it mid-commit.
 * Usage: node --import tsx tests/helpers/import-child.ts <env-json> <userId> <file>
 */
import { parseConfig, setConfig } from '../../server/config.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { Organisation, User, initModels } from '../../server/models/index.ts'
import { importLocalFile } from '../../server/services/import/import-local-file.ts'

const [envJson, userId, file] = process.argv.slice(2)
const cfg = parseConfig(JSON.parse(envJson!) as Record<string, string>)
setConfig(cfg)
const sequelize = createSequelize(cfg)
initModels(sequelize)
const user = await User.findByPk(Number(userId), {
  include: [{ model: Organisation, as: 'organisation' }],
})
if (!user) throw new Error(`no user ${userId}`)
const job = await importLocalFile(user, file!, 'geojson', cfg, sequelize)
console.log(JSON.stringify(job))
await sequelize.close()
