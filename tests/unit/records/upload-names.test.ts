import { describe, expect, it } from 'vitest'
import { storedFileName } from '../../../server/utils/uploads'

describe('stored names of uploads', () => {
  it('keep only the real extension of the type the content was detected as', () => {
    expect(storedFileName('report.pdf.html', 'pdf', 'attachment')).toBe('report.pdf')
    expect(storedFileName('invoice.exe', 'pdf', 'attachment')).toBe('invoice.pdf')
    expect(storedFileName('photo.svg', 'png', 'attachment')).toBe('photo.png')
    expect(storedFileName('drop-soffit.png', 'png', 'attachment')).toBe('drop-soffit.png')
    // another spelling of the same type stays as the engineer wrote it, so figure references hold
    expect(storedFileName('Site photo.JPEG', 'jpg', 'attachment')).toBe('Site photo.JPEG')
    expect(storedFileName('Section v1.2 final.pdf', 'pdf', 'attachment')).toBe('Section v1.2 final.pdf')
  })

  it('take the base name only, with no path, control or markup characters, and never an empty stem', () => {
    expect(storedFileName('..\\..\\windows\\evil.png', 'png', 'attachment')).toBe('evil.png')
    expect(storedFileName('../../etc/passwd', 'pdf', 'attachment')).toBe('passwd.pdf')
    expect(storedFileName('<script>x</script>.png', 'png', 'attachment')).toBe('script_.png')
    expect(storedFileName('.png', 'png', 'attachment')).toBe('attachment.png')
    expect(storedFileName('', 'jpg', 'attachment')).toBe('attachment.jpg')
  })
})
