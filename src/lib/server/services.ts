import { config } from './config';
import { createMailer, type Mailer } from './mail';
import { createStorage, type Storage } from './storage';

let storage: Storage | undefined;
let mailer: Mailer | undefined;

/** The process-wide storage client, made on first use from the settings. */
export function getStorage(): Storage {
	storage ??= createStorage(config.s3);
	return storage;
}

export function getMailer(): Mailer {
	mailer ??= createMailer(config.smtpUrl, config.mailFrom);
	return mailer;
}
