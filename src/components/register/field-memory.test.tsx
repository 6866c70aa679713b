import { photoProblem } from './photo-picker';
import { readFieldMemory, rememberField } from './field-memory';

describe('field entry helpers', () => {
  beforeEach(() => window.localStorage.clear());

  it('when a field entry is saved, then the site, method and emissivity are remembered on this device', () => {
    expect(readFieldMemory()).toEqual({});
    rememberField({ siteId: '3', method: 'infrared', emissivitySetting: 0.95 });
    rememberField({ method: 'contact' });
    expect(readFieldMemory()).toEqual({ siteId: '3', method: 'contact', emissivitySetting: 0.95 });
  });

  it('when the stored memory is damaged or odd, then it is ignored rather than trusted', () => {
    window.localStorage.setItem('lagline.register.field', '{not json');
    expect(readFieldMemory()).toEqual({});
    window.localStorage.setItem('lagline.register.field', JSON.stringify({ siteId: '../x', method: 'laser', emissivitySetting: 7 }));
    expect(readFieldMemory()).toEqual({});
  });

  it('when a file is picked, then a non-photo, an empty or a too-large file is refused before it is sent', () => {
    expect(photoProblem({ name: 'a.jpg', type: 'image/jpeg', size: 1000 })).toBeNull();
    expect(photoProblem({ name: 'notes.txt', type: 'text/plain', size: 10 })).toMatch(/not a JPEG, PNG or WebP photo/);
    expect(photoProblem({ name: 'a.heic', type: 'image/heic', size: 10 })).toMatch(/not a JPEG/);
    expect(photoProblem({ name: 'empty.jpg', type: 'image/jpeg', size: 0 })).toMatch(/empty/);
    expect(photoProblem({ name: 'big.jpg', type: 'image/jpeg', size: 11 * 1024 * 1024 })).toMatch(/larger than 10 MB/);
  });
});
