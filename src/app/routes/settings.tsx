import { CardSection } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { BusinessForm } from '../../features/business/components/business-form';
import { SitesEditor } from '../../features/sites/components/sites-editor';
import { SavedCard } from '../../features/orders/components/saved-card';

export function SettingsRoute() {
  return (
    <div className="flex max-w-3xl flex-col gap-8">
      <PageHeader title="Settings" description="The business's details, how menu prices treat tax, the sites you trade from and the card that pays suppliers." />
      <CardSection title="Business">
        <BusinessForm />
      </CardSection>
      <CardSection title="Sites">
        <SitesEditor />
      </CardSection>
      <CardSection title="Card for supplier orders">
        <SavedCard />
      </CardSection>
    </div>
  );
}
