// `npm run stop`: stops what `npm start` started in the background.
import { stopDetached, stopPostgres } from './lib.mjs'

stopDetached('fake-smtp')
stopDetached('test-server')
stopPostgres()
